import type { ComparisonFigureInput, FitFigureInput, PlanFigureInput, PrecisionFigureInput, TrackingFigureInput } from "../../client/figures/figureInputs.ts";

/**
 * Small hand-made inputs for the figure builders, shaped like the API's JSON.
 * The numbers are invented and chosen so that expected values can be worked
 * out by hand (e.g. an exact exponential with λ = 25 µm).
 */

const xs = [0, 10, 20, 30, 40, 50, 60, 70, 80];
// c = 100·e^(−x/25): exact, so its logarithm is a straight line with slope −1/25.
const exact = xs.map((x) => 100 * Math.exp(-x / 25));
const measured = exact.map((y, i) => y + [1.5, -2, 0.5, 1, -1, 0.5, -0.5, 0.25, -0.25][i]);

export const fitInput: FitFigureInput = {
  id: 7,
  model: "exponential",
  status: "converged",
  result: {
    fit: {
      ok: true,
      model: "exponential",
      status: "converged",
      message: "Converged after 4 iteration(s)",
      xUm: xs.slice(1),
      fitted: exact.slice(1),
      residuals: measured.slice(1).map((y, i) => y - exact[i + 1]),
      parameters: { lambdaUm: { value: 25.04, se: 1.23, ci95: [22.1, 27.98] }, amplitude: { value: 100, se: 2, ci95: [95, 105] } },
      r2: 0.9987,
    },
  },
  profile: { embryo: "e-01", genotype: "wt", channel: "sig", positionsUm: xs, intensities: measured },
};

/** A profile with a non-positive intensity, which a log axis cannot show. */
export const fitWithZero: FitFigureInput = { ...fitInput, profile: { ...fitInput.profile!, intensities: [...measured.slice(0, 8), 0] } };

export const failedFit: FitFigureInput = {
  id: 8,
  model: "exponential",
  status: "no-decay",
  result: { fit: { ok: false, model: "exponential", status: "no-decay", message: "the profile does not decay" } },
  profile: { embryo: "e-02", genotype: "wt", channel: "sig", positionsUm: [0, 10, 20], intensities: [5, 5, 5] },
};

export const precisionInput: PrecisionFigureInput = {
  analysis_id: 3,
  group: "wt",
  channel: "sig",
  n_embryos: 4,
  coords: "absolute",
  unit: "um",
  x: [0, 10, 20, 30, 40],
  mean_intensity: [100, 67, 45, 30, 20],
  sd_intensity: [10, 7, 5, 3, 2],
  sigma_x: [null, 9.5, 10.2, 11, null],
  sigma_x_ci95: [null, [7, 12], [8, 13], [8.5, 14], null],
  sigma_x_summary: { value: 10.2 },
  information_region: { from: 4, to: 36 },
  boundary: { threshold: 40, positions: { a: 24, b: 19, c: 27, d: null }, never_cross: ["d"], mean_position: 23.333333, sd: 4.041452 },
  normalisation: "none",
  decoding: {
    positions: [10, 20, 30],
    probability: [
      [0.75, 0.25, 0],
      [0.25, 0.5, 0.25],
      [0, 0.25, 0.75],
    ],
    decodedMean: [12.5, 20, 27.5],
    rmsError: 7.07,
    leaveOneOut: true,
  },
  joint: { channels: ["sig", "other"], x: [0, 10, 20, 30, 40], sigma_x: [null, 7, 7.5, 8, null] },
};

export const relativePrecision: PrecisionFigureInput = { ...precisionInput, coords: "relative", unit: "fraction of length", x: [0, 0.1, 0.2, 0.3, 0.4], normalisation: "minmax", joint: null, decoding: null };

export const comparisonInput: ComparisonFigureInput = {
  channel: "sig",
  by: "genotype",
  metric: "lambda",
  groups: [
    { name: "mut", n: 3, lambda_um: { n: 3, mean: 40, sd: 2, ci95: [37.7, 42.3] }, amplitude_au: null, boundary_um: null, boundary_sd_um: null, sigma_x_min_um: null },
    { name: "wt", n: 4, lambda_um: { n: 4, mean: 25, sd: 1.5, ci95: [23.5, 26.5] }, amplitude_au: null, boundary_um: null, boundary_sd_um: null, sigma_x_min_um: null },
  ],
  embryo_values: {
    quantity: "lambda_um",
    groups: [
      { name: "mut", values: [{ embryo: "m1", value: 38 }, { embryo: "m2", value: 40 }, { embryo: "m3", value: 42 }] },
      { name: "wt", values: [{ embryo: "w1", value: 23 }, { embryo: "w2", value: 25 }, { embryo: "w3", value: 26 }, { embryo: "w4", value: 26 }] },
    ],
  },
};

export const spreadComparison: ComparisonFigureInput = {
  ...comparisonInput,
  metric: "sigma_x",
  groups: comparisonInput.groups.map((g, i) => ({ ...g, boundary_sd_um: { value: [6, 4][i], se: 1, ci95: [[4, 9], [3, 6]][i] as [number, number] } })),
  embryo_values: { quantity: null, groups: [] },
};

export const timeTracking: TrackingFigureInput = {
  over: "age",
  channel: "sig",
  result: {
    settings: { metric: "lambda", time: "ageS" },
    series: [
      {
        group: "wt",
        numeric: true,
        points: [
          { embryo: "a", time: 600, stage: null, value: 20 },
          { embryo: "b", time: 1200, stage: null, value: 24 },
          { embryo: "c", time: 1800, stage: null, value: 28 },
        ],
        bins: [{ label: "[600, 1800]", meanTime: 1200, summary: { n: 3, mean: 24, sd: 4, ci95: [20, 28] } }],
        trend: { kind: "linear", slope: { value: 1 / 150, se: 0.001, ci95: [0.004, 0.009] }, intercept: { value: 16, se: 1, ci95: [14, 18] } },
      },
      {
        group: "mut",
        numeric: true,
        points: [
          { embryo: "d", time: 600, stage: null, value: 10 },
          { embryo: "e", time: 1200, stage: null, value: 16 },
          { embryo: "f", time: 1800, stage: null, value: 18 },
          { embryo: "g", time: 2400, stage: null, value: 19 },
        ],
        bins: [],
        trend: { kind: "saturating", converged: true, yInf: { value: 20, se: 0.5, ci95: [19, 21] }, y0: { value: 0, se: 2, ci95: [-4, 4] }, tau: { value: 600, se: 60, ci95: [480, 720] }, timeOrigin: 0 },
      },
    ],
  },
};

export const stageTracking: TrackingFigureInput = {
  over: "stage",
  channel: "sig",
  result: {
    settings: { metric: "boundary", time: "stage" },
    series: [
      {
        group: "wt",
        numeric: false,
        points: [
          { embryo: "a", time: null, stage: "early", value: 50 },
          { embryo: "b", time: null, stage: "late", value: 60 },
        ],
        bins: [
          { label: "early", meanTime: null, summary: { n: 1, mean: 50, sd: null, ci95: null } },
          { label: "late", meanTime: null, summary: { n: 1, mean: 60, sd: null, ci95: null } },
        ],
        trend: null,
      },
    ],
  },
};

export const dosageTracking: TrackingFigureInput = {
  over: "dosage",
  channel: "sig",
  result: {
    dosages: [
      { dosage: 0.5, n: 2, boundary_um: { n: 2, mean: 32.7, sd: 1, ci95: [31, 34.4] } },
      { dosage: 1, n: 2, boundary_um: { n: 2, mean: 50, sd: 1, ci95: [48.5, 51.5] } },
      { dosage: 2, n: 2, boundary_um: { n: 2, mean: 67.3, sd: 1, ci95: [65.9, 68.7] } },
    ],
    lambda_from_shift_um: { value: 25, se: 1, ci95: [22, 28] },
    boundary_at_unit_dosage_um: { value: 50, se: 0.5, ci95: [49, 51] },
    lambda_from_fit_um: { value: 24, se: 0.8, ci95: [22.4, 25.6] },
  },
  points: [
    { embryo: "a", group: "g05", dosage: 0.5, boundary_um: 32 },
    { embryo: "b", group: "g05", dosage: 0.5, boundary_um: 33.4 },
    { embryo: "c", group: "wt", dosage: 1, boundary_um: 50 },
    { embryo: "d", group: "g2", dosage: 2, boundary_um: 67.3 },
  ],
};

export const lengthTracking: TrackingFigureInput = {
  over: "length",
  channel: "sig",
  result: { groups: [{ group: "wt", n: 3, lambda: { slope: { value: 1, se: 0.1, ci95: [0.6, 1.4] }, intercept: { value: Math.log(0.05), se: 0.5, ci95: [-4, -2] } }, boundary: null }] },
  points: [
    { embryo: "a", group: "wt", length_um: 400, lambda_um: 20 },
    { embryo: "b", group: "wt", length_um: 500, lambda_um: 25 },
    { embryo: "c", group: "wt", length_um: 600, lambda_um: 30 },
  ],
};

export const planInput: PlanFigureInput = {
  metric: "lambda",
  group: "wt",
  quantity: "mean",
  settings: { power: 0.8, alpha: 0.05, effect: 0.15 },
  n_required: 5,
  table: [
    { n: 3, power_analytic: 0.55, power_simulated: 0.47, power_permutation_simulated: 0 },
    { n: 5, power_analytic: 0.88, power_simulated: 0.86, power_permutation_simulated: 0.87 },
    { n: 4, power_analytic: 0.76, power_simulated: 0.72, power_permutation_simulated: 0.64 },
  ],
};
