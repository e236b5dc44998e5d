import { chartPoints } from "./chartPoints.ts";
import { lineDataset, pointDataset } from "./datasetStyles.ts";
import type { BuildUpFigureInput } from "./dynamicsInputs.ts";
import { SERIES_COLOURS } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/** χ²₁ 95% quantile: the deviance threshold of a 95% profile-likelihood interval. */
const THRESHOLD = 3.841458820694124;

/**
 * Profile likelihood of k (D re-fitted at each k): a flat curve that never
 * crosses the 95% threshold on one side means the data do not identify k.
 * Source: Venzon & Moolgavkar 1988, Appl Stat (profile-likelihood intervals).
 */
export function profileLikelihoodFigure(b: BuildUpFigureInput): FigureConfig {
  const ks = b.profile_likelihood_k.map((p) => p.k_per_s);
  const lo = Math.min(...ks);
  const hi = Math.max(...ks);
  const [a, c] = b.profile_interval_k ?? [null, null];
  const interval = `95% interval [${a === null ? "open" : a.toPrecision(3)}, ${c === null ? "open" : c.toPrecision(3)}] 1/s`;
  return scatterConfig({
    title: `Profile likelihood of k (${b.genotype} / ${b.channel}): ${interval}`,
    datasets: [
      lineDataset("deviance, D re-fitted at each k", chartPoints(ks, b.profile_likelihood_k.map((p) => p.deviance)), SERIES_COLOURS[0]),
      pointDataset("", chartPoints(ks, b.profile_likelihood_k.map((p) => p.deviance)), SERIES_COLOURS[0], 2.5),
      lineDataset("95% threshold (χ²₁ = 3.84)", chartPoints([lo, hi], [THRESHOLD, THRESHOLD]), SERIES_COLOURS[1], { dash: [6, 3] }),
    ],
    x: { title: "degradation rate k (1/s, log scale)", type: "logarithmic" },
    // Sharp profiles reach deviances in the thousands; clip so that the threshold and its crossings stay visible.
    y: { title: "deviance −2Δlog L (dimensionless)", min: 0, max: Math.min(Math.max(...b.profile_likelihood_k.map((p) => p.deviance), 4 * THRESHOLD), 10 * THRESHOLD) },
  });
}
