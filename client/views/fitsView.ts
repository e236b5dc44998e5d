import { fetchChoices } from "../api/fetchChoices.ts";
import { apiGet } from "../api/http.ts";
import type { FitDetail, FitList } from "../api/types/fits.ts";
import { destroyCharts } from "../components/chartPanel.ts";
import { el, replaceChildren } from "../components/el.ts";
import { errorNotice, infoNotice } from "../components/notice.ts";
import { fitDetail } from "./fits/fitDetail.ts";
import { fitForm } from "./fits/fitForm.ts";
import { fitsState } from "./fits/fitsState.ts";
import { fitTable } from "./fits/fitTable.ts";
import { globalFitCard } from "./fits/globalFitPanel.ts";
import { globalFromJob, globalFromStored, type GlobalFitView, type StoredGlobalFit } from "./fits/globalFitView.ts";
import { fitsCsv } from "./fits/fitsCsv.ts";

/** What a single steady-state profile can and cannot tell, in plain words. */
const CAVEAT =
  "One steady-state profile gives only the decay length λ = √(D/k), i.e. the ratio D/k — not D and k separately. " +
  "D and k each need a second measurement: D from FRAP (then k = D/λ²), or the build-up of the gradient over time.";

/** Fits: run fits, read λ ± CI per embryo, open one profile with its curve and residuals, and see the group's global fit. */
export function renderFitsView(root: HTMLElement): void {
  const tableArea = el("div", { "data-role": "fit-table" });
  const detailArea = el("div", { "data-role": "fit-detail", "aria-live": "polite" });
  const globalArea = el("div", { "data-role": "global-fits" });
  const formArea = el("div");

  const openFit = async (fitId: number, tr?: HTMLTableRowElement) => {
    fitsState.selectedFitId = fitId;
    for (const row of tableArea.querySelectorAll("tr.selected")) row.classList.remove("selected");
    tr?.classList.add("selected");
    destroyCharts(detailArea);
    replaceChildren(detailArea, el("p", { class: "muted" }, "Loading the fit…"));
    try {
      replaceChildren(detailArea, fitDetail(await apiGet<FitDetail>(`api/fits/${fitId}`)));
      if (tr) detailArea.scrollIntoView({ block: "nearest" });
    } catch (e) {
      replaceChildren(detailArea, errorNotice(e));
    }
  };

  const loadTable = async () => {
    try {
      const list = await apiGet<FitList>("api/fits", { genotype: fitsState.genotype, channel: fitsState.channel });
      replaceChildren(
        tableArea,
        fitTable(list.fits, fitsCsv(), (f, tr) => void openFit(f.fitId, tr)),
        list.fits.some((f) => f.akaikeWeight !== null) ? el("p", { class: "hint" }, "Akaike weights compare the models stored for the same profile over the same window.") : null,
      );
      const selected = tableArea.querySelector<HTMLTableRowElement>(`tr[data-fit-id="${fitsState.selectedFitId}"]`);
      if (selected) void openFit(fitsState.selectedFitId!, selected);
    } catch (e) {
      replaceChildren(tableArea, errorNotice(e));
    }
  };

  const loadGlobal = async () => {
    const matches = (g: { genotype: string; channel: string }) => (!fitsState.genotype || g.genotype === fitsState.genotype) && (!fitsState.channel || g.channel === fitsState.channel);
    try {
      let views: GlobalFitView[];
      const job = fitsState.lastJob;
      if (job && job.global.length) views = job.global.map(globalFromJob).filter(matches);
      else {
        const { analyses } = await apiGet<{ analyses: StoredGlobalFit[] }>("api/analyses", { kind: "global-fit" });
        // Newest first; keep one per group and model.
        const seen = new Set<string>();
        const newest = analyses.filter((a) => {
          const key = `${a.selection.genotype}|${a.selection.channel}|${a.settings.model}`;
          if (seen.has(key) || !matches({ genotype: a.selection.genotype ?? "", channel: a.selection.channel ?? "" })) return false;
          seen.add(key);
          return true;
        });
        views = (await Promise.all(newest.slice(0, 12).map((a) => apiGet<StoredGlobalFit>(`api/analyses/${a.id}`)))).map(globalFromStored);
      }
      const rankings = new Map((job?.group_model_comparison ?? []).map((c) => [`${c.genotype}|${c.channel}`, c.message]));
      replaceChildren(
        globalArea,
        views.length
          ? el("div", { class: "columns" }, ...views.map((v) => globalFitCard(v, rankings.get(`${v.genotype}|${v.channel}`))))
          : el("p", { class: "muted" }, "No global fit for this selection yet: tick “Also fit each genotype × channel group globally” and press Fit."),
      );
    } catch (e) {
      replaceChildren(globalArea, errorNotice(e));
    }
  };

  const refresh = () => {
    void loadTable();
    void loadGlobal();
  };

  replaceChildren(
    root,
    el("h1", { class: "visually-hidden" }, "Fits"),
    el("section", { class: "panel", "aria-labelledby": "fit-title" }, el("h2", { id: "fit-title" }, "Fit decay lengths"), infoNotice(el("strong", {}, "What a fit can tell you. "), CAVEAT), formArea),
    el("section", { class: "panel", "aria-labelledby": "table-title" }, el("h2", { id: "table-title" }, "Decay length per embryo"), tableArea),
    el("section", { class: "panel", "aria-labelledby": "detail-title" }, el("h2", { id: "detail-title" }, "Selected profile"), detailArea),
    el("section", { class: "panel", "aria-labelledby": "global-title" }, el("h2", { id: "global-title" }, "Group: global fit and per-embryo spread of λ"), globalArea),
  );
  replaceChildren(detailArea, el("p", { class: "muted" }, "Select a row of the table to see the profile, its fitted curve and residuals."));

  fetchChoices()
    .then((choices) => {
      replaceChildren(formArea, fitForm(choices, refresh, () => {
        fitsState.selectedFitId = null;
        refresh();
      }));
      refresh();
    })
    .catch((e) => replaceChildren(formArea, errorNotice(e)));
}
