import type { GroupSummary } from "../../api/types/estimate.ts";
import { csvExportUrl } from "../../api/exportUrl.ts";
import type { DosageTrack, ScalingFit, TimeSeries, TrackingResult } from "../../api/types/groups.ts";
import { chartPanel } from "../../components/chartPanel.ts";
import { dataTable } from "../../components/dataTable.ts";
import { el } from "../../components/el.ts";
import { keyNumbers } from "../../components/keyNumbers.ts";
import { infoNotice, warningNotice } from "../../components/notice.ts";
import { trendFigure } from "../../figures/index.ts";
import { formatEstimate, formatInterval } from "../../format/formatEstimate.ts";
import { formatPValue } from "../../format/formatPValue.ts";
import { formatSignificant } from "../../format/significant.ts";
import { uncertaintyDecimals } from "../../format/uncertaintyDecimals.ts";
import { METRICS } from "./metricUnits.ts";

const meanSem = (s: GroupSummary | null) => (s ? formatEstimate({ value: s.mean, se: s.sem }) : "—");
const ci = (s: GroupSummary | null) => (s ? formatInterval(s.ci95, uncertaintyDecimals(s.sem)) : "—");

function timeSeries(r: TrackingResult, s: TimeSeries, metric: string): HTMLElement {
  const m = METRICS[metric] ?? { name: metric, unit: "" };
  const t = s.trend;
  const timeUnit = r.over === "age" ? "s" : "stage";
  const steady = s.steadyState;
  return el(
    "div",
    { class: "series", "data-group": s.group },
    el("h3", {}, `${s.group} — ${s.n} embryos`),
    keyNumbers([
      t?.kind === "saturating"
        ? { label: `Plateau (${m.unit})`, value: t.converged ? formatEstimate(t.yInf, m.unit, { ci: true }) : "—", note: t.converged ? `time constant ${formatEstimate(t.tau, timeUnit)}` : (t.reason ?? "the saturating fit did not converge"), key: "plateau" }
        : { label: `Trend slope (${m.unit} per ${timeUnit})`, value: t ? formatEstimate(t.slope, "", { ci: true }) : "—", note: t ? `linear; p = ${formatPValue(t.pSlope)}; R² = ${formatSignificant(t.r2, 2)}` : undefined, key: "slope" },
      {
        label: "Steady state",
        value: steady?.notAtSteadyState === null || steady === null ? "not decided" : steady.notAtSteadyState ? "not yet at steady state" : "no evidence of change late on",
        note: steady ? steady.reasons.join("; ") : undefined,
      },
    ]),
    s.trendNote ? el("p", { class: "hint" }, s.trendNote) : null,
    steady ? el("p", { class: "hint" }, `Rule: ${steady.rule}.`) : null,
    dataTable({
      caption: `${m.name} per ${r.over} bin (${m.unit})`,
      rows: s.bins,
      csv: { fileName: `tracking-${r.analysis_id}-${s.group}-bins.csv` },
      columns: [
        { header: `Bin (${timeUnit})`, cell: (b) => b.label },
        { header: "n", cell: (b) => b.summary?.n ?? 0, numeric: true },
        { header: `Mean ± SEM (${m.unit})`, cell: (b) => meanSem(b.summary), numeric: true },
        { header: `95% CI (${m.unit})`, cell: (b) => ci(b.summary), numeric: true },
        { header: `SD (${m.unit})`, cell: (b) => formatSignificant(b.summary?.sd ?? null, 3), numeric: true },
      ],
    }),
  );
}

function dosage(r: TrackingResult, d: DosageTrack): HTMLElement {
  const agree = d.agree;
  return el(
    "div",
    { class: "dosage" },
    keyNumbers([
      { label: "λ from the boundary shift (µm)", value: d.lambda_from_shift_um ? formatEstimate(d.lambda_from_shift_um, "µm", { ci: true }) : "not estimated", note: d.shift_refused ?? d.shift_method ?? "slope of boundary against ln(dosage)", key: "lambda-shift" },
      ...(d.no_crossing
        ? [{ label: "Embryos that never cross the threshold", value: String(d.no_crossing.before_start + d.no_crossing.beyond_end), note: `${d.no_crossing.before_start} start below it, ${d.no_crossing.beyond_end} never fall below it; kept as censored values, not dropped`, key: "no-crossing" }]
        : []),
      { label: "λ from the profile fits (µm)", value: formatEstimate(d.lambda_from_fit_um, "µm", { ci: true }), key: "lambda-fit" },
      { label: "Difference, shift − fits (µm)", value: formatEstimate(d.difference_um, "µm", { ci: true }) },
      { label: "Do they agree?", value: agree === null || agree === undefined ? "cannot tell" : agree ? "yes: the 95% CI of the difference includes 0" : "no: the 95% CI of the difference excludes 0", key: "agree" },
    ]),
    ...d.warnings.map((w) => warningNotice(w)),
    infoNotice(el("strong", {}, "The shift equals λ·ln(dosage) only if: "), d.assumptions.join("; "), "."),
    dataTable({
      caption: "Boundary position per dosage (µm); means and t intervals of the embryos that crossed",
      rows: d.dosages,
      csv: { fileName: `tracking-${r.analysis_id}-dosages.csv` },
      columns: [
        { header: "Dosage (× wild type)", cell: (x) => formatSignificant(x.dosage, 3), numeric: true },
        { header: "Embryos", cell: (x) => x.n_embryos ?? x.n, numeric: true },
        { header: "Crossed", cell: (x) => x.n, numeric: true },
        { header: "Never crossed (start below / stay above)", cell: (x) => (x.no_crossing ? `${x.no_crossing.before_start} / ${x.no_crossing.beyond_end}` : "—"), numeric: true },
        { header: "Mean ± SEM (µm)", cell: (x) => meanSem(x.boundary_um), numeric: true },
        { header: "95% CI (µm)", cell: (x) => ci(x.boundary_um), numeric: true },
        { header: "SD (µm)", cell: (x) => formatSignificant(x.boundary_um?.sd ?? null, 3), numeric: true },
      ],
    }),
  );
}

function scaling(f: ScalingFit | null): string {
  if (!f) return "—";
  const verdict = f.consistent_with_scaling && f.consistent_with_no_scaling ? "cannot tell scaling from no scaling" : f.consistent_with_scaling ? "consistent with scaling (slope 1)" : f.consistent_with_no_scaling ? "consistent with no scaling (slope 0)" : "neither scaling nor constant";
  return `${formatEstimate(f.slope, "", { ci: true })} — ${verdict}`;
}

/** A tracking result: the figure and, by kind, the trend, the dosage test or the size scaling. */
export function trackResult(r: TrackingResult, metric: string): HTMLElement {
  const body: (HTMLElement | null)[] = [];
  if (r.over === "dosage") body.push(dosage(r, r.result));
  else if (r.over === "length")
    body.push(
      ...r.result.groups.map((g) =>
        el(
          "div",
          { class: "scaling", "data-group": g.group },
          el("h3", {}, `${g.group} — ${g.n} embryos`),
          keyNumbers([
            { label: "λ against length: log–log slope", value: scaling(g.lambda), key: "lambda-scaling" },
            { label: "Boundary against length: log–log slope", value: scaling(g.boundary) },
          ]),
          g.note ? el("p", { class: "hint" }, g.note) : null,
        ),
      ),
    );
  else body.push(...r.result.series.map((s) => timeSeries(r, s, metric)));
  return el(
    "div",
    { class: "tracking-result", "data-analysis-id": String(r.analysis_id), "data-over": r.over },
    r.boundary_threshold ? el("p", { class: "hint" }, `Boundary threshold: ${formatSignificant(r.boundary_threshold.value, 4)} a.u. (${r.boundary_threshold.source}).`) : null,
    chartPanel(`Trend over ${r.over}`, trendFigure(r), { kind: "trend", query: { analysis: r.analysis_id } }),
    el("p", {}, el("a", { class: "btn btn-secondary", href: csvExportUrl("tracking", { analysis: r.analysis_id }), download: "", "data-role": "csv-points" }, "Download the per-embryo values (CSV)")),
    ...body,
  );
}
