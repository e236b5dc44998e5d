import type { Choices } from "../../api/fetchChoices.ts";
import { csvExportUrl } from "../../api/exportUrl.ts";
import { apiGet, apiPost } from "../../api/http.ts";
import type { GroupSummary } from "../../api/types/estimate.ts";
import type { ComparisonGroup, ComparisonResult, Contrast } from "../../api/types/groups.ts";
import type { JobView } from "../../api/types/job.ts";
import { chartPanel, destroyCharts } from "../../components/chartPanel.ts";
import { dataTable } from "../../components/dataTable.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, field, numberInput, numberValue, select } from "../../components/formFields.ts";
import { runJob } from "../../components/jobProgress.ts";
import { infoNotice, warningNotice } from "../../components/notice.ts";
import { groupValuesFigure } from "../../figures/index.ts";
import { formatEstimate, formatEstimateInterval, formatInterval } from "../../format/formatEstimate.ts";
import { formatPValue } from "../../format/formatPValue.ts";
import { formatSignificant } from "../../format/significant.ts";
import { uncertaintyDecimals } from "../../format/uncertaintyDecimals.ts";
import { groupsState } from "./groupsState.ts";
import { METRICS } from "./metricUnits.ts";
import { recordsFields } from "./recordsFields.ts";

/** The summary of the compared metric for one group, as mean with its CI (or a spread estimate). */
function summaryOf(g: ComparisonGroup, metric: string): { summary: GroupSummary | null; spread: ComparisonGroup["boundary_sd_um"] } {
  if (metric === "amplitude") return { summary: g.amplitude_au, spread: null };
  if (metric === "boundary") return { summary: g.boundary_um, spread: null };
  if (metric === "sigma_x") return { summary: null, spread: g.sigma_x_min_um ?? g.boundary_sd_um };
  return { summary: g.lambda_um, spread: null };
}

/** Rounding place of a group summary: from its SEM. */
const placeOf = (s: GroupSummary) => uncertaintyDecimals(s.sem);

function groupTable(r: ComparisonResult): HTMLElement {
  const m = METRICS[r.metric];
  return dataTable<ComparisonGroup>({
    caption: `${m.name} by ${r.by} (${m.unit}; ${r.channel}, ${r.fit_model} fits)`,
    rows: r.groups,
    csv: { href: csvExportUrl("comparison", { analysis: r.analysis_id }) },
    rowData: (g) => ({ group: g.name }),
    columns: [
      { header: "Group", cell: (g) => g.name },
      { header: "n (embryos)", cell: (g) => g.n, numeric: true },
      {
        header: `Mean ± SEM (${m.unit})`,
        cell: (g) => {
          const { summary, spread } = summaryOf(g, r.metric);
          if (summary) return formatEstimate({ value: summary.mean, se: summary.sem });
          return spread ? formatEstimate(spread) : "—";
        },
        numeric: true,
      },
      {
        header: `95% CI, t (${m.unit})`,
        cell: (g) => {
          const { summary, spread } = summaryOf(g, r.metric);
          if (summary) return formatInterval(summary.ci95, placeOf(summary));
          return spread ? formatEstimateInterval(spread) : "—";
        },
        numeric: true,
      },
      {
        header: `Bootstrap 95% CI, second opinion (${m.unit})`,
        cell: (g) => {
          const { summary } = summaryOf(g, r.metric);
          return summary?.bootstrap_ci95 ? formatInterval(summary.bootstrap_ci95, placeOf(summary)) : "—";
        },
        numeric: true,
      },
      { header: `SD (${m.unit})`, cell: (g) => formatSignificant(summaryOf(g, r.metric).summary?.sd ?? null, 3), numeric: true },
      { header: `Median (${m.unit})`, cell: (g) => formatSignificant(summaryOf(g, r.metric).summary?.median ?? null, 4), numeric: true },
      { header: "CV", cell: (g) => formatSignificant(summaryOf(g, r.metric).summary?.cv ?? null, 2), numeric: true },
      ...(r.metric === "lambda" ? [{ header: "Global λ (µm)", cell: (g: ComparisonGroup) => formatEstimate(g.lambda_global_um, "", { ci: true }), numeric: true }] : []),
    ],
  });
}

function contrastTable(r: ComparisonResult): HTMLElement {
  const m = METRICS[r.metric];
  const interval = (i: Contrast["difference"]) => (i ? `${formatSignificant(i.value, 3)} ${formatInterval(i.ci95, i.ci95 ? uncertaintyDecimals(Math.abs(i.ci95[1] - i.ci95[0]) / 4) : null)}` : "—");
  const boot = (i: Contrast["difference"]) => (i?.bootstrap_ci95 ? formatInterval(i.bootstrap_ci95, uncertaintyDecimals(Math.abs(i.bootstrap_ci95[1] - i.bootstrap_ci95[0]) / 4)) : "—");
  const means = r.metric !== "sigma_x";
  return dataTable<Contrast>({
    caption: means
      ? `Contrasts (${m.name}): difference with Welch's t interval, ratio with Fieller's interval (95%; both agree with Welch's p); bootstrap intervals shown as a second opinion; p-values two-sided, Holm-adjusted across the contrasts`
      : `Contrasts (${m.name}): ratio and difference of spreads with bootstrap 95% CIs; p-values two-sided, Holm-adjusted across the contrasts`,
    rows: r.contrasts,
    csv: { href: csvExportUrl("comparison", { analysis: r.analysis_id }) },
    rowData: (c) => ({ pair: `${c.a}|${c.b}` }),
    empty: "Only one group: nothing to contrast.",
    columns: [
      { header: "A vs B", cell: (c) => `${c.a} vs ${c.b}` },
      { header: "n A / n B", cell: (c) => `${c.n_a} / ${c.n_b}`, numeric: true },
      { header: `Difference A − B (${m.unit}) [95% CI${means ? ", Welch t" : ""}]`, cell: (c) => interval(c.difference), numeric: true },
      { header: `Ratio A / B [95% CI${means ? ", Fieller" : ""}]`, cell: (c) => interval(c.ratio), numeric: true },
      ...(means
        ? [
          { header: `Difference, bootstrap 95% CI (second opinion)`, cell: (c: Contrast) => boot(c.difference), numeric: true },
          { header: "Ratio, bootstrap 95% CI (second opinion)", cell: (c: Contrast) => boot(c.ratio), numeric: true },
        ]
        : []),
      { header: "Welch p", cell: (c) => formatPValue(c.p_welch), numeric: true },
      { header: "Permutation p", cell: (c) => formatPValue(c.p_permutation), numeric: true },
      ...(r.contrasts.some((c) => c.p_spread !== null) ? [{ header: "Spread p", cell: (c: Contrast) => formatPValue(c.p_spread), numeric: true }] : []),
      { header: "Holm p", cell: (c) => formatPValue(c.p_holm), numeric: true },
      { header: "Hedges' g [95% CI]", cell: (c) => (c.effect_size ? formatEstimate(c.effect_size, "", { ci: true }) : "—"), numeric: true },
      { header: "Note", cell: (c) => c.note ?? "" },
    ],
  });
}

/** The comparison's figure, tables and notes. */
export function comparisonResult(r: ComparisonResult): HTMLElement {
  return el(
    "div",
    { class: "comparison-result", "data-analysis-id": String(r.analysis_id) },
    r.boundary_threshold && (r.metric === "boundary" || r.metric === "sigma_x") ? infoNotice(`Boundary threshold: ${formatSignificant(r.boundary_threshold.value, 4)} a.u. (${r.boundary_threshold.source}).`) : null,
    r.fitted_now ? infoNotice(`${r.fitted_now} profiles had no ${r.fit_model} fit yet and were fitted for this comparison.`) : null,
    ...r.warnings.map((w) => warningNotice(w)),
    chartPanel(`${METRICS[r.metric].name} by ${r.by}`, groupValuesFigure(r), { kind: "group-values", query: { analysis: r.analysis_id } }),
    groupTable(r),
    contrastTable(r),
  );
}

/** Compare groups: the settings, the Compare button and the result. */
export function compareSection(choices: Choices): HTMLElement {
  const s = groupsState.compare;
  if (!s.records.genotypes.length) s.records.genotypes = [...choices.genotypes];
  const records = recordsFields(choices, s.records, "Embryos of genotypes");
  const by = select("by", [
    ["genotype", "genotype"],
    ["stage", "stage"],
    ["dosage", "dosage"],
    ["session", "session"],
  ], s.by);
  const reference = select("reference", [["", "every pair"]]);
  const metric = select("metric", Object.entries(METRICS).map(([k, v]): [string, string] => [k, `${v.name} (${v.unit})`]), s.metric);
  const permutations = numberInput("permutations", s.permutations, { min: 99, step: 1 });
  const bootstrap = numberInput("bootstrap", s.bootstrap, { min: 100, step: 1 });
  const progress = el("div", { "data-role": "compare-progress" });
  const out = el("div", { "data-role": "compare-result" });

  const loadReferences = async () => {
    const { values } = await apiGet<{ values: string[] }>("api/groups", { by: by.value });
    const chosen = records.read().genotypes;
    const names = by.value === "genotype" && chosen.length ? values.filter((v) => chosen.includes(v)) : values;
    reference.replaceChildren(el("option", { value: "" }, "every pair"), ...names.map((v) => el("option", { value: v }, v)));
    reference.value = names.includes(s.reference) ? s.reference : names.includes("wt") ? "wt" : "";
  };
  by.addEventListener("change", () => void loadReferences());
  records.element.addEventListener("change", () => void loadReferences());
  void loadReferences();

  const start = async () => {
    s.records = records.read();
    s.by = by.value;
    s.reference = reference.value;
    s.metric = metric.value;
    s.permutations = numberValue(permutations) ?? 10000;
    s.bootstrap = numberValue(bootstrap) ?? 2000;
    const body = { ...records.body(), by: s.by, metric: s.metric, permutations: Math.round(s.permutations), bootstrap: Math.round(s.bootstrap), ...(s.reference ? { reference: s.reference } : {}) };
    run.disabled = true;
    const result = await runJob<ComparisonResult>(progress, "Comparing groups", () => apiPost<JobView>("api/comparisons", body));
    run.disabled = false;
    if (result) {
      s.result = result;
      replaceChildren(progress);
      destroyCharts(out);
      replaceChildren(out, comparisonResult(result));
    }
  };
  const run = button("Compare", () => void start(), "primary", { "data-role": "start-compare" });
  if (s.result) replaceChildren(out, comparisonResult(s.result));

  return el(
    "section",
    { class: "panel", "aria-labelledby": "compare-title" },
    el("h2", { id: "compare-title" }, "Compare groups"),
    records.element,
    el("div", { class: "field-row" }, field("Groups by", by), field("Compare with", reference), field("Quantity", metric), field("Permutations", permutations), field("Bootstrap resamples", bootstrap)),
    el("div", { class: "actions" }, run),
    progress,
    out,
  );
}
