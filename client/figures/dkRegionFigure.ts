import { chartPoints } from "./chartPoints.ts";
import { lineDataset, pointDataset } from "./datasetStyles.ts";
import type { BuildUpFigureInput } from "./dynamicsInputs.ts";
import { SERIES_COLOURS } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/** √χ²₂(0.95): the radius, in standard errors, of a joint 95% region of two normal estimates. */
export const JOINT_95_RADIUS = Math.sqrt(5.991464547107979);

/**
 * The joint 95% confidence region of (D, k) from their standard errors and correlation: the ellipse
 * {θ : (θ − θ̂)ᵀ C⁻¹ (θ − θ̂) = χ²₂(0.95)}, drawn through the Cholesky factor of C (common practice, no
 * source). Points are given clockwise from θ = 0; `steps` segments close the curve.
 */
export function jointRegion95(
  d: { value: number; se: number },
  k: { value: number; se: number },
  correlation: number,
  steps = 96,
): { dUm2PerS: number; kPerS: number }[] {
  const r = Math.max(-1, Math.min(1, correlation));
  const c = Math.sqrt(1 - r * r);
  return Array.from({ length: steps + 1 }, (_, i) => {
    const t = (2 * Math.PI * i) / steps;
    const u = Math.cos(t);
    const v = Math.sin(t);
    return { dUm2PerS: d.value + JOINT_95_RADIUS * d.se * u, kPerS: k.value + JOINT_95_RADIUS * k.se * (r * u + c * v) };
  });
}

/**
 * D against k: the joint 95% region of the estimates, the valley the profile likelihood follows (D
 * re-fitted at each k) and the line λ = √(D/k) = λ̂. A region stretched along that line means the data
 * fix λ but not D and k separately (a steady state alone gives only λ).
 */
export function dkRegionFigure(b: BuildUpFigureInput): FigureConfig {
  const datasets = [];
  const d = b.D_um2_per_s;
  const k = b.k_per_s;
  const regionKs: number[] = [];
  if (d && k && typeof d.se === "number" && typeof k.se === "number" && b.correlation_D_k !== null) {
    const region = jointRegion95({ value: d.value, se: d.se }, { value: k.value, se: k.se }, b.correlation_D_k);
    regionKs.push(...region.map((p) => p.kPerS));
    datasets.push(lineDataset("joint 95% region (from SEs and correlation)", chartPoints(region.map((p) => p.kPerS), region.map((p) => p.dUm2PerS)), SERIES_COLOURS[0]));
  }
  // The profile is computed far out in k; show it where it is still near the region (deviance ≤ 3·χ²₂(0.95)).
  const valley = b.profile_likelihood_k.filter((p) => p.D_um2_per_s !== undefined && Number.isFinite(p.D_um2_per_s) && p.deviance <= 3 * JOINT_95_RADIUS ** 2);
  if (valley.length > 1) {
    datasets.push(lineDataset("profile: D re-fitted at each k", chartPoints(valley.map((p) => p.k_per_s), valley.map((p) => p.D_um2_per_s as number)), SERIES_COLOURS[1], { dash: [6, 3] }));
  }
  if (d && k) {
    const lambdaSq = d.value / k.value;
    const ks = [...regionKs, ...valley.map((p) => p.k_per_s)];
    if (ks.length === 0) ks.push(k.value * 0.5, k.value * 1.5);
    const lo = Math.min(...ks);
    const hi = Math.max(...ks);
    datasets.push(lineDataset(`λ = √(D/k) = ${Math.sqrt(lambdaSq).toPrecision(3)} µm`, chartPoints([lo, hi], [lo * lambdaSq, hi * lambdaSq]), SERIES_COLOURS[2], { dash: [2, 3], width: 1.5 }));
    datasets.push(pointDataset("estimate", chartPoints([k.value], [d.value]), SERIES_COLOURS[0], 4));
  }
  return scatterConfig({
    title: `D and k jointly (${b.genotype} / ${b.channel})`,
    datasets,
    x: { title: "degradation rate k (1/s)" },
    y: { title: "diffusion coefficient D (µm²/s)" },
  });
}
