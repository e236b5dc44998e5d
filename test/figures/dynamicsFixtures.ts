import type { BuildUpFigureInput, FrapFigureInput, SimulationFigureInput } from "../../client/figures/dynamicsInputs.ts";

// Hand-made figure inputs (invented numbers, shaped like the API's answers).
const est = (value: number, se: number) => ({ value, se, ci95: [value - 2 * se, value + 2 * se] as [number, number] });

export const buildUpInput: BuildUpFigureInput = {
  analysis_id: 7,
  genotype: "wt",
  channel: "glm-gfp",
  status: "ok",
  D_um2_per_s: est(1.3, 0.05),
  k_per_s: est(2e-4, 1e-5),
  lambda_um: est(80, 2),
  accumulation_time_s: [0, 50, 100].map((x) => ({ x_um: x, ...est(2500 + 30 * x, 100) })),
  correlation_D_k: 0.8,
  profile_likelihood_k: [1e-4, 2e-4, 4e-4].map((k, i) => ({ k_per_s: k, deviance: [8, 0, 9][i], D_um2_per_s: 6400 * k * [0.95, 1, 1.06][i] })),
  profile_interval_k: [1.5e-4, 3e-4],
  points: [600, 3600].flatMap((t) => [0, 20, 40].map((x) => ({ x_um: x, t_s: t, value: 100 * Math.exp(-x / 80) * (t / 3600) + 1, fitted: 100 * Math.exp(-x / 80) * (t / 3600) }))),
};

export const frapInput: FrapFigureInput = {
  analysis_id: 8,
  D_um2_per_s: est(1.2, 0.04),
  curves: [{ name: "cell1.csv", status: "ok", D_um2_per_s: est(1.2, 0.08), points: [0.1, 0.5, 1, 2].map((t) => ({ t_s: t, value: 0.3 + 0.5 * (1 - Math.exp(-t)), fitted: 0.3 + 0.5 * (1 - Math.exp(-t)) + 0.01 })) }],
};

export const simulationInput: SimulationFigureInput = {
  D_um2_per_s: { value: 0.3, se: null, ci95: null },
  k_per_s: { value: 2e-4, se: null, ci95: null },
  lambda_um: { value: 38.7, se: null, ci95: null },
  positions_um: [5, 15, 25],
  profiles: [{ t_s: 1800, values: [10, 5, 2] }, { t_s: 3600, values: [14, 8, 4] }],
  steady_state: [20, 15, 10],
};
