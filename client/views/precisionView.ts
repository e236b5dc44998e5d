import { fetchChoices } from "../api/fetchChoices.ts";
import type { PrecisionJobResult } from "../api/types/precision.ts";
import { destroyCharts } from "../components/chartPanel.ts";
import { el, replaceChildren } from "../components/el.ts";
import { errorNotice } from "../components/notice.ts";
import { precisionForm } from "./precision/precisionForm.ts";
import { precisionResult } from "./precision/precisionResult.ts";
import { precisionState } from "./precision/precisionState.ts";

/** Precision: positional error, boundary variability, positional information and the decoding map across replicate embryos. */
export function renderPrecisionView(root: HTMLElement): void {
  const formArea = el("div");
  const results = el("div", { "data-role": "precision-results" });
  const show = (r: PrecisionJobResult) => {
    destroyCharts(results);
    replaceChildren(results, ...r.results.map(precisionResult));
  };
  replaceChildren(
    root,
    el("h1", { class: "visually-hidden" }, "Precision"),
    el("section", { class: "panel", "aria-labelledby": "precision-title" }, el("h2", { id: "precision-title" }, "Positional precision across embryos"), formArea),
    results,
  );
  if (precisionState.result) show(precisionState.result);
  fetchChoices()
    .then((choices) => replaceChildren(formArea, precisionForm(choices, show)))
    .catch((e) => replaceChildren(formArea, errorNotice(e)));
}
