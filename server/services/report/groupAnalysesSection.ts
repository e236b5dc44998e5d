import { formatInterval, formatNumber, formatWithError } from "../../../client/figures/figureNumbers.ts";
import type { DosageResult } from "../../analysis/compare/tracking/dosageSeries.ts";
import type { ScalingResult } from "../../analysis/compare/tracking/sizeScaling.ts";
import type { TrackResult } from "../../analysis/compare/tracking/trackOverTime.ts";
import { figureHtml, type EmbeddedFigure } from "./embeddedFigure.ts";
import { escapeHtml } from "./escapeHtml.ts";
import type { ReportData } from "./gatherReport.ts";
import { htmlTable } from "./htmlTable.ts";
import { settingsBlock } from "./settingsBlock.ts";

type Figures = (section: string) => EmbeddedFigure[];
const p = (v: number | null) => (v === null ? "—" : v < 1e-4 ? "< 0.0001" : v.toFixed(4));
const list = (items: string[]) => `<ul>${items.map((i) => `<li>${escapeHtml(i)}</li>`).join("")}</ul>`;
const figuresHtml = (f: EmbeddedFigure[]) => `<div class="figures">${f.map(figureHtml).join("")}</div>`;
const METRIC_UNIT: Record<string, string> = { lambda: "µm", amplitude: "a.u.", boundary: "µm", sigma_x: "µm" };

function comparisons(data: ReportData, figures: Figures): string {
  return data.comparisons
    .map(({ response: c, provenance: prov }) => {
      const u = METRIC_UNIT[c.metric] ?? "";
      const summary = (g: (typeof c.groups)[number]) => (c.metric === "lambda" ? g.lambda_um : c.metric === "amplitude" ? g.amplitude_au : c.metric === "boundary" ? g.boundary_um : null);
      const groups = htmlTable(
        ["group", "embryos", `mean (${u}) ± SD`, "95% CI of the mean (t interval)", "λ of the global fit (µm)", "boundary SD (µm)"],
        c.groups.map((g) => {
          const s = summary(g);
          return [g.name, g.n, s ? `${formatNumber(s.mean)}${s.sd !== null ? ` ± ${formatNumber(s.sd)}` : ""}` : null, s ? formatInterval(s.ci95) : null, g.lambda_global_um ? formatWithError(g.lambda_global_um.value, g.lambda_global_um.se) : null, g.boundary_sd_um ? `${formatNumber(g.boundary_sd_um.value)} ${formatInterval(g.boundary_sd_um.ci95)}` : null];
        }),
        [false, true, true, true, true, true],
      );
      const means = c.metric !== "sigma_x";
      const contrasts = htmlTable(
        ["contrast", `difference (${u})`, means ? "95% CI (Welch t)" : "95% CI", "ratio", means ? "95% CI (Fieller)" : "95% CI", ...(means ? ["bootstrap 95% CI of the difference (second opinion)", "bootstrap 95% CI of the ratio (second opinion)"] : []), "Hedges' g", "p (Welch)", "p (permutation)", "p (Holm-adjusted)"],
        c.contrasts.map((k) => [
          `${k.a} − ${k.b}`, k.difference ? formatNumber(k.difference.value) : null, formatInterval(k.difference?.ci95), k.ratio ? formatNumber(k.ratio.value) : null, formatInterval(k.ratio?.ci95),
          ...(means ? [formatInterval(k.difference?.bootstrap_ci95 ?? null), formatInterval(k.ratio?.bootstrap_ci95 ?? null)] : []),
          k.effect_size ? formatNumber(k.effect_size.value) : null, p(k.p_welch), p(k.p_permutation ?? k.p_spread), p(k.p_holm),
        ]),
        [false, true, true, true, true, ...(means ? [true, true] : []), true, true, true, true],
      );
      const intervalNote = means
        ? "<p>Intervals: group means use the t interval; differences use Welch's t interval and ratios Fieller's interval with Welch's degrees of freedom, so an interval excludes 0 (difference) or 1 (ratio) exactly when p (Welch) is below 0.05. Bootstrap intervals are a second opinion only: they under-cover with few embryos per group.</p>"
        : "";
      const warnings = c.warnings.length ? list(c.warnings) : "";
      return `<section class="analysis"><h3>Comparison #${c.analysis_id}: ${escapeHtml(c.metric)} by ${escapeHtml(c.by)} (${escapeHtml(c.channel)})</h3>${groups}${contrasts}${intervalNote}${warnings}${settingsBlock(`Settings of comparison #${prov.analysisId}: engine ${prov.engineVersion}, stored ${prov.createdAt}`, { request: prov.settings, resolved: c.settings })}${figuresHtml(figures(`comparison:${c.analysis_id}`))}</section>`;
    })
    .join("");
}

function trackingSummary(t: ReportData["trackings"][number]["response"]): string[] {
  if (t.over === "dosage") {
    const d = t.result as DosageResult;
    const per = (d.dosages ?? []).map((lv) => `${lv.dosage}×: ${lv.n_embryos ?? lv.n} embryos, ${(lv.no_crossing?.before_start ?? 0) + (lv.no_crossing?.beyond_end ?? 0)} never cross the threshold`).join("; ");
    return [
      `Embryos per dosage: ${per}.`,
      `λ from the boundary shift (slope of boundary on ln dosage): ${d.lambda_from_shift_um ? `${formatWithError(d.lambda_from_shift_um.value, d.lambda_from_shift_um.se, "µm")} ${formatInterval(d.lambda_from_shift_um.ci95)}` : "not estimated"}${d.shift_refused ? ` — refused: ${d.shift_refused}` : d.shift_method ? ` (${d.shift_method})` : ""}.`,
      `λ from the profile fits: ${d.lambda_from_fit_um ? `${formatWithError(d.lambda_from_fit_um.value, d.lambda_from_fit_um.se, "µm")} ${formatInterval(d.lambda_from_fit_um.ci95)}` : "—"}; ${d.agree === null ? "agreement could not be judged" : d.agree ? "the two agree (the CI of their difference contains 0)" : "the two DISAGREE"}.`,
      `Assumes: ${d.assumptions.join("; ")}.`,
    ];
  }
  if (t.over === "length") {
    return (t.result as ScalingResult).groups.map((g) => `${g.group}: ${g.n} embryos; log–log slope of λ on length ${g.lambda ? `${formatNumber(g.lambda.slope.value)} ${formatInterval(g.lambda.slope.ci95)}` : "—"}, of the boundary ${g.boundary ? `${formatNumber(g.boundary.slope.value)} ${formatInterval(g.boundary.slope.ci95)}` : "—"} (1 = perfect scaling, 0 = none).`);
  }
  return (t.result as TrackResult).series.map((s) => {
    const trend = s.trend?.kind === "linear" ? `linear trend, slope ${formatWithError(s.trend.slope.value, s.trend.slope.se)} ${formatInterval(s.trend.slope.ci95)} per ${t.over === "age" ? "s" : "stage"}` : s.trend?.kind === "saturating" && s.trend.yInf ? `saturating trend, plateau ${formatWithError(s.trend.yInf.value, s.trend.yInf.se)}` : (s.trendNote ?? "no trend fitted");
    const steady = s.steadyState?.notAtSteadyState === true ? `not at steady state (${s.steadyState.reasons.join("; ")})` : s.steadyState?.notAtSteadyState === false ? "no sign of change late in the range" : "steady state not assessed";
    return `${s.group}: ${s.n} embryos; ${trend}; ${steady}.`;
  });
}

function trackings(data: ReportData, figures: Figures): string {
  return data.trackings
    .map(({ response: t, provenance: prov }) => `<section class="analysis"><h3>Tracking #${t.analysis_id}: over ${escapeHtml(t.over)} (${escapeHtml(t.channel)})</h3>${list(trackingSummary(t))}${settingsBlock(`Settings of tracking analysis #${prov.analysisId}: engine ${prov.engineVersion}, stored ${prov.createdAt}`, { request: prov.settings, resolved: t.result.settings })}${figuresHtml(figures(`tracking:${t.analysis_id}`))}</section>`)
    .join("");
}

function plans(data: ReportData, figures: Figures): string {
  return data.plans
    .map(({ response: r, provenance: prov }) => {
      const table = htmlTable(["embryos per group", "power, exact", "power, normal approximation", "power, simulated", "power, simulated permutation test"], r.table.map((row) => [row.n, row.power_analytic.toFixed(3), row.power_normal.toFixed(3), row.power_simulated.toFixed(3), row.power_permutation_simulated?.toFixed(3)]), [true, true, true, true, true]);
      return `<section class="analysis"><h3>Sample-size plan #${r.analysis_id}: ${escapeHtml(r.metric)}${r.group ? ` (variability of ${escapeHtml(r.group)})` : ""}</h3>${list([`${r.n_required}${r.capped ? " or more (search capped)" : ""} embryos per group to detect a ${formatNumber(r.settings.effect * 100)}% change with power ${r.settings.power} at α = ${r.settings.alpha}.`, `Method: ${r.formula}.`, ...(r.variability_group ? [`Used the ${r.variability_group.sentence}.`] : []), ...r.notes])}${table}${settingsBlock(`Settings of plan #${prov.analysisId}: engine ${prov.engineVersion}, stored ${prov.createdAt}`, { request: prov.settings, resolved: r.settings })}${figuresHtml(figures(`plan:${r.analysis_id}`))}</section>`;
    })
    .join("");
}

/** Stored comparisons, tracking analyses and sample-size plans, newest first; a sentence when there are none. */
export function groupAnalysesSection(data: ReportData, figures: Figures): string {
  const none = (what: string) => `<p>No ${what} stored for the reported channels.</p>`;
  return [
    `<section id="comparisons"><h2>Group comparisons</h2>${data.comparisons.length ? comparisons(data, figures) : none("comparison is")}</section>`,
    `<section id="tracking"><h2>Tracking over stage, age, dosage and size</h2>${data.trackings.length ? trackings(data, figures) : none("tracking analysis is")}</section>`,
    `<section id="plans"><h2>Sample-size plans</h2>${data.plans.length ? plans(data, figures) : none("plan is")}</section>`,
  ].join("");
}
