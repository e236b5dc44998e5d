import { apiPost } from "../../api/http.ts";
import type { JobView } from "../../api/types/job.ts";
import type { FrapResult } from "../../api/types/dynamics.ts";
import { chartPanel, destroyCharts } from "../../components/chartPanel.ts";
import { dropZone } from "../../components/dropZone.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, field, numberInput, numberValue, select } from "../../components/formFields.ts";
import { runJob } from "../../components/jobProgress.ts";
import { errorNotice, infoNotice, warningNotice } from "../../components/notice.ts";
import { frapRecoveryFigure, frapResidualFigure } from "../../figures/index.ts";
import { formatEstimate } from "../../format/formatEstimate.ts";
import { quantityTiles } from "./quantityTiles.ts";

function frapResult(r: FrapResult): HTMLElement {
  const source = { kind: "", query: { analysis: r.analysis_id } };
  return el(
    "div",
    { class: "result-block", "data-role": "frap-result" },
    el("h3", {}, `FRAP analysis ${r.analysis_id}: ${r.n_fitted} of ${r.n_curves} curves fitted (${r.summary_method})`),
    quantityTiles(r),
    el(
      "ul",
      { class: "plain-list" },
      ...r.curves.map((c) =>
        el(
          "li",
          {},
          el("strong", {}, c.name),
          `: ${c.status === "ok" ? `D = ${formatEstimate(c.D_um2_per_s as never, "µm²/s", { ci: true })}, mobile fraction ${formatEstimate(c.mobile_fraction, "", { ci: true })}, t½ = ${formatEstimate(c.half_time_s, "s", { ci: true })}` : c.message}`,
          el("br"),
          el("small", {}, `Normalisation: ${c.normalisation.join("; ")}`),
          ...c.warnings.map((w) => warningNotice(w)),
        ),
      ),
    ),
    infoNotice(r.caveat),
    el(
      "div",
      { class: "chart-grid" },
      chartPanel("FRAP recovery with fits", frapRecoveryFigure(r), { ...source, kind: "frap-recovery" }),
      chartPanel("Residuals of the FRAP fits", frapResidualFigure(r), { ...source, kind: "frap-residuals" }),
    ),
  );
}

/** Fit FRAP recovery tables (uploaded, or the demo curves); `onResult` learns the stored analysis id. */
export function frapSection(onResult: (id: number) => void): HTMLElement {
  const geometry = select("geometry", [["spot", "circular spot (2D)"], ["strip", "strip on a long line (1D)"], ["rod", "strip in a closed rod"]]);
  const size = numberInput("size", 3, { min: 0 });
  const rodFrom = numberInput("rod-from", "", { min: 0, placeholder: "strip start" });
  const rodTo = numberInput("rod-to", "", { min: 0, placeholder: "strip end" });
  const rodLength = numberInput("rod-length", "", { min: 0, placeholder: "rod length" });
  const turnover = select("turnover", [["none", "not modelled"], ["fit", "fitted"]]);
  const out = el("div", { "data-role": "frap-results" });
  let files: File[] = [];
  const chosen = el("p", { class: "hint", "data-role": "frap-files" }, "No files chosen.");
  const options = () => {
    const g = geometry.value;
    const geo =
      g === "spot" ? { kind: "spot", radiusUm: numberValue(size) } : g === "strip" ? { kind: "strip", widthUm: numberValue(size) } : { kind: "rod", fromUm: numberValue(rodFrom), toUm: numberValue(rodTo), lengthUm: numberValue(rodLength) };
    return { geometry: geo, degradation: { mode: turnover.value } };
  };
  const show = (r: FrapResult | null) => {
    if (!r) return;
    replaceChildren(out, frapResult(r));
    onResult(r.analysis_id);
  };
  const runFiles = async () => {
    destroyCharts(out);
    if (files.length === 0) {
      replaceChildren(out, errorNotice(new Error("Choose one or more FRAP tables first.")));
      return;
    }
    const texts = await Promise.all(files.map(async (f) => ({ name: f.name, text: await f.text() })));
    show(await runJob<FrapResult>(out, "Fitting FRAP curves", () => apiPost<JobView>("api/dynamics/frap", { files: texts, options: options() })));
  };
  const runDemo = async () => {
    destroyCharts(out);
    show(await runJob<FrapResult>(out, "Fitting the demo FRAP curves", () => apiPost<JobView>("api/dynamics/frap/demo", { options: { ...options(), geometry: { kind: "spot", radiusUm: 3 } } })));
  };
  return el(
    "section",
    { class: "panel", "aria-labelledby": "frap-title", "data-section": "frap" },
    el("h2", { id: "frap-title" }, "FRAP: D and the mobile fraction"),
    el("p", {}, "Tables with a time column (s; pre-bleach frames at negative times or flagged in a “prebleach” column), the bleached-region intensity “bleached”, and optional “reference” and “background” columns — or a “normalised” curve. The intensity just after the bleach is fitted."),
    dropZone((f) => {
      files = f;
      chosen.textContent = `${f.length} file${f.length === 1 ? "" : "s"}: ${f.map((x) => x.name).join(", ")}`;
    }, "Drop FRAP recovery tables here (CSV or TSV), one file per cell"),
    chosen,
    el("div", { class: "form-row" }, field("Bleach geometry", geometry), field("Radius or width (µm)", size, "spot radius or strip width"), field("Rod: strip from (µm)", rodFrom), field("Rod: strip to (µm)", rodTo), field("Rod length (µm)", rodLength), field("Turnover", turnover, "ignoring degradation makes D come out too high")),
    el("div", { class: "actions" }, button("Fit FRAP files", () => void runFiles(), "primary", { "data-role": "fit-frap" }), button("Use the demo FRAP curves", () => void runDemo(), "secondary", { "data-role": "fit-demo-frap" })),
    out,
  );
}
