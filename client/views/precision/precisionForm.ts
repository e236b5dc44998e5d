import type { Choices } from "../../api/fetchChoices.ts";
import { apiPost } from "../../api/http.ts";
import type { JobView } from "../../api/types/job.ts";
import type { PrecisionJobResult } from "../../api/types/precision.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, checkboxGroup, field, numberInput, numberValue, select, textInput } from "../../components/formFields.ts";
import { runJob } from "../../components/jobProgress.ts";
import { warningNotice } from "../../components/notice.ts";
import { parseNumberList } from "../../format/parseNumberList.ts";
import { precisionState as state } from "./precisionState.ts";

/** The precision settings and the Run button; calls `onDone` with the job's result. */
export function precisionForm(choices: Choices, onDone: (r: PrecisionJobResult) => void): HTMLElement {
  if (!state.genotypes.length) state.genotypes = choices.genotypes.includes("wt") ? ["wt"] : choices.genotypes.slice(0, 1);
  if (!state.channels.length) state.channels = choices.channels.slice(0, 1);
  const genotypes = checkboxGroup("Genotypes (each analysed as its own group)", "genotypes", choices.genotypes.map((g) => [g, g]), state.genotypes);
  const channels = checkboxGroup("Channels (several: joint positional error)", "channels", choices.channels.map((c) => [c, c]), state.channels);
  const coords = select("coords", [
    ["absolute", "absolute: µm from the source"],
    ["relative", "relative: fraction of embryo length x/L"],
  ], state.coords);
  const normalisation = select("normalisation", [
    ["none", "none: intensities as measured (a.u.)"],
    ["minmax", "per embryo: minimum 0, maximum 1"],
    ["scale-offset", "per embryo: scale and offset matched to the mean"],
  ], state.normalisation);
  const derivative = select("derivative", [
    ["savitzky-golay", "smoothed mean (Savitzky–Golay)"],
    ["model", "exponential fitted to the mean"],
  ], state.derivative);
  const flip = select("flip", [
    ["none", "none: only flag embryos that run backwards"],
    ["auto", "auto: reverse them"],
  ], state.flip);
  const boundaryBy = select("boundaryBy", [
    ["default", "automatic: the mean's level mid-region"],
    ["threshold", "at an intensity threshold"],
    ["position", "at the mean's level at a position"],
  ], state.boundaryBy);
  const boundaryValue = numberInput("boundaryValue", state.boundaryValue ?? "", { placeholder: "threshold or position" });
  const boundaryUnit = el("small", { class: "hint" });
  const positions = textInput("positions", state.positions, "e.g. 100, 150");
  const bootstrap = numberInput("bootstrap", state.bootstrap, { min: 0, max: 100000, step: 1 });
  const regionFrom = numberInput("regionFrom", state.regionFrom ?? "", { placeholder: "default" });
  const regionTo = numberInput("regionTo", state.regionTo ?? "", { placeholder: "default" });
  const windowFrom = numberInput("windowFrom", state.windowFrom ?? "", { placeholder: "region start" });
  const windowTo = numberInput("windowTo", state.windowTo ?? "", { placeholder: "region end" });
  const showWindow = () => {
    windowFrom.disabled = windowTo.disabled = derivative.value !== "model";
  };
  derivative.addEventListener("change", showWindow);
  showWindow();
  const problems = el("div", { "aria-live": "polite" });
  const progress = el("div", { "data-role": "precision-progress" });

  const lengthUnit = () => (coords.value === "relative" ? "x/L" : "µm");
  const intensityUnit = () => (normalisation.value === "none" ? "a.u." : "normalised, 0–1 scale");
  const showUnit = () => {
    boundaryUnit.textContent = boundaryBy.value === "threshold" ? `intensity (${intensityUnit()})` : boundaryBy.value === "position" ? `position (${lengthUnit()})` : "";
    boundaryValue.disabled = boundaryBy.value === "default";
  };
  for (const s of [boundaryBy, coords, normalisation]) s.addEventListener("change", showUnit);
  showUnit();

  const start = async () => {
    const list = parseNumberList(positions.value);
    state.genotypes = genotypes.values();
    state.channels = channels.values();
    state.coords = coords.value;
    state.normalisation = normalisation.value;
    state.derivative = derivative.value;
    state.flip = flip.value;
    state.boundaryBy = boundaryBy.value as typeof state.boundaryBy;
    state.boundaryValue = numberValue(boundaryValue);
    state.positions = positions.value;
    state.bootstrap = numberValue(bootstrap) ?? 1000;
    state.regionFrom = numberValue(regionFrom);
    state.regionTo = numberValue(regionTo);
    state.windowFrom = numberValue(windowFrom);
    state.windowTo = numberValue(windowTo);
    const region = state.regionFrom !== undefined && state.regionTo !== undefined ? [state.regionFrom, state.regionTo] : undefined;
    const issues = [
      !state.genotypes.length && "Choose at least one genotype.",
      !state.channels.length && "Choose at least one channel.",
      list.invalid.length && `“σ_x at positions” has parts that are not numbers: ${list.invalid.join(", ")}.`,
      state.boundaryBy !== "default" && state.boundaryValue === undefined && "Give the boundary's threshold or position, or choose the automatic boundary.",
      (state.regionFrom === undefined) !== (state.regionTo === undefined) && "Give both ends of the region, or leave both empty for the default.",
      region && !(region[0] < region[1]) && "The region's start must be below its end.",
    ].filter((x): x is string => typeof x === "string");
    replaceChildren(problems, ...issues.map((i) => warningNotice(i)));
    if (issues.length) return;
    const body = {
      selection: { genotypes: state.genotypes },
      channels: state.channels,
      coords: state.coords,
      normalisation: state.normalisation,
      derivative: state.derivative,
      flip: state.flip,
      bootstrap: Math.round(state.bootstrap),
      positions: list.numbers,
      ...(region ? { region } : {}),
      ...(state.derivative === "model" && (state.windowFrom !== undefined || state.windowTo !== undefined) ? { modelWindow: { from: state.windowFrom, to: state.windowTo } } : {}),
      ...(state.boundaryBy === "threshold" ? { threshold: state.boundaryValue } : {}),
      ...(state.boundaryBy === "position" ? { atPosition: state.boundaryValue } : {}),
    };
    run.disabled = true;
    const result = await runJob<PrecisionJobResult>(progress, "Precision analysis", () => apiPost<JobView>("api/precision", body));
    run.disabled = false;
    if (result) {
      state.result = result;
      replaceChildren(progress, el("p", { class: "muted", "data-role": "precision-done" }, `Done: ${result.results.length} group${result.results.length === 1 ? "" : "s"} analysed.`));
      onDone(result);
    }
  };
  const run = button("Run precision analysis", () => void start(), "primary", { "data-role": "start-precision" });

  return el(
    "div",
    {},
    el("div", { class: "columns" }, genotypes.element, channels.element),
    el(
      "div",
      { class: "field-row" },
      field("Coordinates", coords),
      field("Normalisation", normalisation),
      field("Slope of the mean", derivative),
      field("Orientation", flip),
    ),
    el(
      "div",
      { class: "field-row" },
      field("Boundary", boundaryBy),
      el("div", { class: "field" }, el("label", { for: "boundary-value" }, "Threshold or position"), Object.assign(boundaryValue, { id: "boundary-value" }), boundaryUnit),
      field("σ_x at positions", positions, "in the coordinates chosen; point as decimal mark"),
      field("Bootstrap resamples", bootstrap, "of whole embryos; 1000 recommended"),
    ),
    el(
      "div",
      { class: "field-row" },
      field("Region from", regionFrom, "positional information and the headline σ_x; the same for every genotype"),
      field("Region to", regionTo, "empty: the span every profile covers, trimmed by 10% at each end"),
      field("Model fit window from", windowFrom, "only for the exponential slope; empty: the region"),
      field("Model fit window to", windowTo),
    ),
    problems,
    el("div", { class: "actions" }, run),
    progress,
  );
}
