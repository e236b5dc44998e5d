import type { GroupSummary } from "../../analysis/compare/summarizeGroup.ts";
import type { ComparisonResponse } from "../groups/comparisonResponse.ts";
import type { CsvTable } from "./csvText.ts";

interface GroupEstimate {
  kind: string;
  unit: string;
  n: number | null;
  value: number;
  sd: number | null;
  ci95: [number, number] | null;
}

/** The per-group number the comparison contrasts: a mean for λ, amplitude and boundary; a spread for sigma_x (minimal σ_x when every group has one, else the boundary SD). */
function groupEstimate(g: GroupSummary, metric: ComparisonResponse["metric"], allHaveSigma: boolean): GroupEstimate | null {
  const mean = (s: GroupSummary["lambda_um"], unit: string): GroupEstimate | null => (s ? { kind: "mean", unit, n: s.n, value: s.mean, sd: s.sd, ci95: s.ci95 } : null);
  if (metric === "lambda") return mean(g.lambda_um, "µm");
  if (metric === "amplitude") return mean(g.amplitude_au, "a.u.");
  if (metric === "boundary") return mean(g.boundary_um, "µm");
  const spread = allHaveSigma ? g.sigma_x_min_um : g.boundary_sd_um;
  return spread ? { kind: allHaveSigma ? "minimal sigma_x" : "boundary SD", unit: "µm", n: g.boundary_sd_um?.n ?? null, value: spread.value, sd: null, ci95: spread.ci95 } : null;
}

/**
 * Groups and contrasts in one table, told apart by `section`: a "group" row
 * holds the group's estimate with its 95% CI; a "contrast" row holds
 * group − versus and group / versus with their CIs, Hedges' g and the p-values
 * (Holm-adjusted across the run's contrasts in p_holm). Units are in `unit`.
 * `interval_method` names how the CIs were formed (t interval for a group mean,
 * Welch's t for a difference, Fieller for a ratio); the bootstrap_* columns hold
 * the bootstrap intervals kept as a second opinion (of the group mean or the
 * difference; ratio_bootstrap_* of the ratio).
 */
export function comparisonTable(c: ComparisonResponse): CsvTable {
  const allHaveSigma = c.groups.every((g) => g.sigma_x_min_um);
  const unit = c.metric === "amplitude" ? "a.u." : "µm";
  const rows = [
    ...c.groups.map((g) => {
      const e = groupEstimate(g, c.metric, allHaveSigma);
      const m = c.metric === "lambda" ? g.lambda_um : c.metric === "amplitude" ? g.amplitude_au : c.metric === "boundary" ? g.boundary_um : null;
      return ["group", g.name, null, c.metric, e?.kind, e?.unit ?? unit, e?.n ?? g.n, null, e?.value, e?.sd, e?.ci95?.[0], e?.ci95?.[1], null, null, null, null, null, null, null, null, null, null, null,
        m?.ci_method ?? null, null, m?.bootstrap_ci95?.[0] ?? null, m?.bootstrap_ci95?.[1] ?? null, null, null];
    }),
    ...c.contrasts.map((k) => [
      "contrast", k.a, k.b, k.metric, k.source, unit, k.n_a, k.n_b, null, null, null, null,
      k.difference?.value, k.difference?.ci95?.[0], k.difference?.ci95?.[1], k.ratio?.value, k.ratio?.ci95?.[0], k.ratio?.ci95?.[1],
      k.effect_size?.value, k.p_welch, k.p_permutation, k.p_spread, k.p_holm,
      k.difference?.interval_method ?? null, k.ratio?.interval_method ?? null,
      k.difference?.bootstrap_ci95?.[0] ?? null, k.difference?.bootstrap_ci95?.[1] ?? null, k.ratio?.bootstrap_ci95?.[0] ?? null, k.ratio?.bootstrap_ci95?.[1] ?? null,
    ]),
  ];
  return {
    columns: [
      "section", "group", "versus", "metric", "estimate_kind", "unit", "n", "n_versus", "estimate", "sd", "ci95_low", "ci95_high",
      "difference", "difference_ci95_low", "difference_ci95_high", "ratio", "ratio_ci95_low", "ratio_ci95_high",
      "hedges_g", "p_welch", "p_permutation", "p_spread", "p_holm",
      "interval_method", "ratio_interval_method", "bootstrap_ci95_low", "bootstrap_ci95_high", "ratio_bootstrap_ci95_low", "ratio_bootstrap_ci95_high",
    ],
    rows,
  };
}
