import type { Choices } from "../../api/fetchChoices.ts";
import { apiPost } from "../../api/http.ts";
import type { CombineResult } from "../../api/types/dynamics.ts";
import { chartPanel, destroyCharts } from "../../components/chartPanel.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, field, numberInput, numberValue, select } from "../../components/formFields.ts";
import { errorNotice, infoNotice } from "../../components/notice.ts";
import { accumulationTimeFigure } from "../../figures/index.ts";
import { formatEstimate } from "../../format/formatEstimate.ts";
import { quantityTiles } from "./quantityTiles.ts";

/** k, half-life, j0 and τ(x) from a FRAP D and a group's stored global fit. */
export function combineSection(choices: Choices): { element: HTMLElement; setFrap(id: number): void } {
  const frapId = numberInput("frap-analysis", "", { min: 1, step: 1, placeholder: "fit FRAP curves above" });
  const genotype = select("genotype", choices.genotypes.map((g): [string, string] => [g, g]), choices.genotypes.includes("wt") ? "wt" : undefined);
  const channel = select("channel", choices.channels.map((c): [string, string] => [c, c]), choices.channels.includes("glm") ? "glm" : undefined);
  const out = el("div", { "data-role": "combine-results" });
  const run = async () => {
    destroyCharts(out);
    try {
      const r = await apiPost<CombineResult>("api/dynamics/combine", { frapAnalysisId: numberValue(frapId), genotype: genotype.value, channel: channel.value });
      replaceChildren(
        out,
        el("h3", {}, `${r.genotype} / ${r.channel}, ${r.model} global fit of ${r.n_embryos} embryos`),
        quantityTiles(r, r.source_flux ? [{ label: "source flux j0", value: formatEstimate(r.source_flux, "", { ci: true }), key: "j0" }] : []),
        ...r.method.map((m) => el("p", { class: "hint" }, m)),
        infoNotice(r.caveat),
        r.accumulation_time_s.length ? chartPanel("Local accumulation time", accumulationTimeFigure(r), { kind: "accumulation-time", query: { analysis: r.analysis_id } }) : null,
      );
    } catch (e) {
      replaceChildren(out, errorNotice(e));
    }
  };
  const element = el(
    "section",
    { class: "panel", "aria-labelledby": "combine-title", "data-section": "combine" },
    el("h2", { id: "combine-title" }, "Combine: FRAP D with a steady-state λ"),
    el("p", {}, "Needs a stored global fit of the group (Fits view, “global fit”). k = D/λ², half-life = ln2/k, j0 = A·D/λ and τ(x), with propagated uncertainty."),
    el("div", { class: "form-row" }, field("FRAP analysis", frapId), field("Genotype", genotype), field("Channel", channel)),
    button("Combine", () => void run(), "primary", { "data-role": "combine" }),
    out,
  );
  return { element, setFrap: (id) => (frapId.value = String(id)) };
}
