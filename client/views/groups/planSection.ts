import type { Choices } from "../../api/fetchChoices.ts";
import { csvExportUrl } from "../../api/exportUrl.ts";
import { apiPost } from "../../api/http.ts";
import type { PlanResult } from "../../api/types/groups.ts";
import type { JobView } from "../../api/types/job.ts";
import { chartPanel, destroyCharts } from "../../components/chartPanel.ts";
import { dataTable } from "../../components/dataTable.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, field, numberInput, numberValue, select } from "../../components/formFields.ts";
import { runJob } from "../../components/jobProgress.ts";
import { keyNumbers } from "../../components/keyNumbers.ts";
import { warningNotice } from "../../components/notice.ts";
import { powerFigure } from "../../figures/index.ts";
import { formatPercent } from "../../format/formatPercent.ts";
import { formatSignificant } from "../../format/significant.ts";
import { groupsState } from "./groupsState.ts";
import { recordsFields } from "./recordsFields.ts";

const power = (p: number | null) => (p === null ? "—" : formatSignificant(p, 2));

/** The plan's answer, figure and power table. */
export function planResult(r: PlanResult): HTMLElement {
  const what = r.metric === "sigma_x" ? "spread (σ_x or boundary SD)" : "mean λ";
  return el(
    "div",
    { class: "plan-result", "data-analysis-id": String(r.analysis_id) },
    keyNumbers([
      { label: "Embryos per group", value: `${r.n_required}${r.capped ? " or more (search capped)" : ""}`, note: `to detect a ${formatPercent(r.settings.effect, 0)} change in ${what} with power ${r.settings.power} at α = ${r.settings.alpha}`, key: "n-required" },
      { label: "Embryo-to-embryo CV used", value: formatPercent(r.cv, 1), note: r.variability_group ? r.variability_group.sentence : `from the embryos of ${r.group}` },
      { label: "Standardised effect", value: formatSignificant(r.standardized_effect, 3), note: "change ÷ CV" },
      { label: "Normal approximation", value: `${r.n_normal} per group` },
    ]),
    el("p", { class: "hint" }, `Formula: ${r.formula}.`),
    ...r.notes.map((n) => warningNotice(n)),
    chartPanel("Power against embryos per group", powerFigure(r), { kind: "power", query: { analysis: r.analysis_id } }),
    dataTable({
        caption: "Power by embryos per group (probability of detecting the change)",
        rows: r.table,
        csv: { href: csvExportUrl("plan", { analysis: r.analysis_id }) },
        rowData: (t) => ({ n: String(t.n) }),
        columns: [
          { header: "Embryos per group", cell: (t) => t.n, numeric: true },
          { header: "Exact power", cell: (t) => power(t.power_analytic), numeric: true },
          { header: "Normal approximation", cell: (t) => power(t.power_normal), numeric: true },
          { header: "Simulated", cell: (t) => power(t.power_simulated), numeric: true },
          { header: "Simulated, permutation test", cell: (t) => power(t.power_permutation_simulated), numeric: true },
        ],
      }),
  );
}

/** How many embryos per group an experiment needs, from the variability already measured. */
export function planSection(choices: Choices): HTMLElement {
  const s = groupsState.plan;
  if (!s.records.genotypes.length) s.records.genotypes = [...choices.genotypes];
  const records = recordsFields(choices, s.records, "Embryos whose variability is used");
  const effect = numberInput("effect", s.effectPercent, { placeholder: "e.g. 10" });
  const powerIn = numberInput("power", s.power, { min: 0.01, max: 0.99, step: 0.01 });
  const alpha = numberInput("alpha", s.alpha, { min: 0.001, max: 0.49, step: 0.01 });
  const metric = select("metric", [
    ["lambda", "mean λ"],
    ["sigma_x", "spread (σ_x or boundary SD)"],
  ], s.metric);
  const group = select("group", [["", "the most variable group"], ...choices.genotypes.map((g): [string, string] => [g, g])], s.group);
  const progress = el("div", { "data-role": "plan-progress" });
  const out = el("div", { "data-role": "plan-result" });

  const start = async () => {
    s.records = records.read();
    s.effectPercent = numberValue(effect) ?? 10;
    s.power = numberValue(powerIn) ?? 0.8;
    s.alpha = numberValue(alpha) ?? 0.05;
    s.metric = metric.value;
    s.group = group.value;
    const body = { ...records.body(), effect: s.effectPercent / 100, power: s.power, alpha: s.alpha, metric: s.metric, ...(s.group ? { group: s.group } : {}) };
    run.disabled = true;
    const result = await runJob<PlanResult>(progress, "Planning", () => apiPost<JobView>("api/plans", body));
    run.disabled = false;
    if (result) {
      s.result = result;
      replaceChildren(progress);
      destroyCharts(out);
      replaceChildren(out, planResult(result));
    }
  };
  const run = button("Plan", () => void start(), "primary", { "data-role": "start-plan" });
  if (s.result) replaceChildren(out, planResult(s.result));

  return el(
    "section",
    { class: "panel", "aria-labelledby": "plan-title" },
    el("h2", { id: "plan-title" }, "Sample-size planner"),
    records.element,
    el("div", { class: "field-row" }, field("Change to detect (%)", effect, "relative; negative for a decrease"), field("Power", powerIn, "0–1"), field("α (two-sided)", alpha), field("Quantity", metric), field("Variability of", group)),
    el("div", { class: "actions" }, run),
    progress,
    out,
  );
}
