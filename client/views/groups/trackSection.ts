import type { Choices } from "../../api/fetchChoices.ts";
import { apiPost } from "../../api/http.ts";
import type { TrackingResult } from "../../api/types/groups.ts";
import type { JobView } from "../../api/types/job.ts";
import { destroyCharts } from "../../components/chartPanel.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, field, numberInput, numberValue, select } from "../../components/formFields.ts";
import { runJob } from "../../components/jobProgress.ts";
import { groupsState } from "./groupsState.ts";
import { recordsFields } from "./recordsFields.ts";
import { trackResult } from "./trackResult.ts";

/** Follow a gradient over stage or age, across a dosage series, or with embryo size. */
export function trackSection(choices: Choices): HTMLElement {
  const s = groupsState.track;
  if (!s.records.genotypes.length) s.records.genotypes = choices.genotypes.includes("wt") ? ["wt"] : choices.genotypes.slice(0, 1);
  const records = recordsFields(choices, s.records, "Embryos of genotypes (for dosage: every line of the series)");
  const over = select("over", [
    ["stage", "stage"],
    ["age", "age"],
    ["dosage", "dosage: λ from the boundary shift"],
    ["length", "embryo length: scaling"],
  ], s.over);
  const metric = select("metric", [
    ["lambda", "decay length λ (µm)"],
    ["amplitude", "amplitude (a.u.)"],
    ["boundary", "boundary position (µm)"],
  ], s.metric);
  const trend = select("trend", [
    ["linear", "linear"],
    ["saturating", "saturating (approach to a plateau)"],
    ["none", "none"],
  ], s.trend);
  const bins = numberInput("bins", s.bins, { min: 1, max: 200, step: 1 });
  const timeOnly = el("div", { class: "field-row" }, field("Quantity over time", metric), field("Trend", trend), field("Time bins", bins));
  const showTimeOnly = () => {
    timeOnly.hidden = over.value === "dosage" || over.value === "length";
  };
  over.addEventListener("change", showTimeOnly);
  showTimeOnly();
  const progress = el("div", { "data-role": "track-progress" });
  const out = el("div", { "data-role": "track-result" });

  const start = async () => {
    s.records = records.read();
    s.over = over.value;
    s.metric = metric.value;
    s.trend = trend.value;
    s.bins = numberValue(bins) ?? 6;
    const body = { ...records.body(), over: s.over, metric: s.metric, trend: s.trend, bins: Math.round(s.bins) };
    run.disabled = true;
    const result = await runJob<TrackingResult>(progress, "Tracking", () => apiPost<JobView>("api/tracking", body));
    run.disabled = false;
    if (result) {
      s.result = result;
      replaceChildren(progress);
      destroyCharts(out);
      replaceChildren(out, trackResult(result, s.metric));
    }
  };
  const run = button("Track", () => void start(), "primary", { "data-role": "start-track" });
  if (s.result) replaceChildren(out, trackResult(s.result, s.metric));

  return el(
    "section",
    { class: "panel", "aria-labelledby": "track-title" },
    el("h2", { id: "track-title" }, "Trends over stage, age, dosage and size"),
    records.element,
    el("div", { class: "field-row" }, field("Follow over", over)),
    timeOnly,
    el("div", { class: "actions" }, run),
    progress,
    out,
  );
}
