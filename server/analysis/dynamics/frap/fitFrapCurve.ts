import { tQuantile95 } from "../../fit/tQuantile95.ts";
import type { ParameterEstimate } from "../../fit/parameterEstimate.ts";
import { parameterEstimate } from "../../fit/parameterEstimate.ts";
import { solveLinear } from "../../linalg/solveLinear.ts";
import { levenbergMarquardt } from "../leastSquares.ts";
import type { FrapFitOptions } from "./frapFitOptions.ts";
import { recoveryHalfTime, recoveryWithTurnover, turnoverPlateau } from "./recoveryModel.ts";

/** A normalised recovery curve: post-bleach times (s, bleach at 0) and intensities (pre-bleach = 1). */
export interface RecoveryCurve {
  timesS: ArrayLike<number>;
  values: ArrayLike<number>;
}

export type FrapFit =
  | {
      ok: true;
      diffusionUm2PerS: ParameterEstimate;
      mobileFraction: ParameterEstimate;
      /** Normalised intensity just after the bleach (fitted, not the first frame). */
      postBleachIntensity: ParameterEstimate;
      /** Fitted or fixed turnover rate (1/s); null without turnover. */
      degradationPerS: ParameterEstimate | null;
      halfTimeS: ParameterEstimate;
      residualSd: number;
      nPoints: number;
      fitted: number[];
      residuals: number[];
      /** Correlation of log D with the mobile fraction. */
      correlationDMobile: number;
      warnings: string[];
    }
  | { ok: false; reason: string; nPoints: number };

/**
 * Fit F(t) = F0 + b·g(t; D, k) to a normalised recovery curve, with
 * F0 the intensity just after the bleach and the mobile fraction Mf = b/(1 − F0)
 * (so that (F − F0)/(1 − F0) = Mf·g). D is fitted on the log scale; its 95%
 * interval is the Wald interval of log D carried back (always positive), the
 * others are Wald t-intervals from s²(JᵀJ)⁻¹; Mf and t½ by the delta method.
 * F0 is fitted because recovery starts during the first frame: pinning it to
 * the first post-bleach value biases D (common practice, no source).
 * Start: a grid over log D (and log k) with F0 and b solved linearly.
 */
export function fitFrapCurve(curve: RecoveryCurve, options: FrapFitOptions): FrapFit {
  const t = Float64Array.from(curve.timesS);
  const y = Float64Array.from(curve.values);
  const n = t.length;
  const fitK = options.degradation.mode === "fit";
  const fixedK = options.degradation.mode === "fixed" ? options.degradation.perS : 0;
  const p = 3 + (fitK ? 1 : 0);
  if (n < p + 3) return { ok: false, reason: `a recovery curve needs at least ${p + 3} post-bleach frames, this one has ${n}`, nPoints: n };
  if (t.some((v) => !(v > 0))) return { ok: false, reason: "post-bleach times must be after the bleach (t > 0 s)", nPoints: n };
  const geometry = options.geometry;
  const shape = (logD: number, logK: number | null) => {
    const d = Math.exp(logD);
    const k = logK === null ? fixedK : Math.exp(logK);
    return t.map((ti) => recoveryWithTurnover(geometry, ti, d, k));
  };
  const linear = (g: Float64Array): [number, number, number] => {
    let sg = 0, sgg = 0, sy = 0, sgy = 0;
    for (let i = 0; i < n; i++) {
      sg += g[i]; sgg += g[i] * g[i]; sy += y[i]; sgy += g[i] * y[i];
    }
    const ab = solveLinear([[n, sg], [sg, sgg]], [sy, sgy]);
    if (ab === null) return [NaN, NaN, Infinity];
    let ss = 0;
    for (let i = 0; i < n; i++) ss += (y[i] - ab[0] - ab[1] * g[i]) ** 2;
    return [ab[0], ab[1], ss];
  };
  // D from the spread of recovery times: scan 6 decades around the diffusion time of the first and last frame.
  const size = geometry.kind === "spot" ? geometry.radiusUm : geometry.kind === "strip" ? geometry.widthUm : geometry.toUm - geometry.fromUm;
  const tMin = t.reduce((a, b) => Math.min(a, b));
  const tMax = t.reduce((a, b) => Math.max(a, b));
  const logDLo = Math.log((size * size) / (100 * tMax));
  const logDHi = Math.log((100 * size * size) / tMin);
  const logKGrid = fitK ? Array.from({ length: 9 }, (_, i) => Math.log(0.01 / tMax) + (i * Math.log(1000)) / 8) : [null];
  let best: { logD: number; logK: number | null; a: number; b: number; ss: number } | null = null;
  for (let i = 0; i <= 40; i++) {
    const logD = logDLo + ((logDHi - logDLo) * i) / 40;
    for (const logK of logKGrid) {
      const [a, b, ss] = linear(shape(logD, logK));
      if (best === null || ss < best.ss) best = { logD, logK, a, b, ss };
    }
  }
  if (best === null || !Number.isFinite(best.ss)) return { ok: false, reason: "no starting value fitted the curve", nPoints: n };
  const start = [best.logD, best.a, best.b, ...(fitK ? [best.logK as number] : [])];
  const lower = [logDLo - 3, -1, -2, ...(fitK ? [Math.log(1e-4 / tMax)] : [])];
  const upper = [logDHi + 3, 2, 3, ...(fitK ? [Math.log(1e3 / tMin)] : [])];
  const fit = levenbergMarquardt(
    (q) => {
      const g = shape(q[0], fitK ? q[3] : null);
      const r = new Float64Array(n);
      for (let i = 0; i < n; i++) r[i] = y[i] - q[1] - q[2] * g[i];
      return r;
    },
    start,
    lower,
    upper,
  );
  const [logD, a, b] = fit.parameters;
  const logK = fitK ? fit.parameters[3] : null;
  const df = n - p;
  const s2 = fit.sumOfSquares / df;
  const tq = tQuantile95(df);
  const cov = fit.inverseInformation?.map((row) => row.map((v) => v * s2)) ?? null;
  const warnings: string[] = [];
  if (cov === null) warnings.push("the fit is ill-conditioned: D, the mobile fraction and the post-bleach intensity cannot be separated from this curve; no uncertainties are given");
  const d = Math.exp(logD);
  const k = logK === null ? fixedK : Math.exp(logK);
  const varLogD = cov ? cov[0][0] : null;
  const diffusion: ParameterEstimate =
    varLogD !== null && varLogD >= 0
      ? { value: d, se: d * Math.sqrt(varLogD), ci95: [d * Math.exp(-tq * Math.sqrt(varLogD)), d * Math.exp(tq * Math.sqrt(varLogD))], unit: "µm²/s", fixed: false }
      : { value: d, se: null, ci95: null, unit: "µm²/s", fixed: false };
  // Mf = b/(1 − a): ∂/∂a = b/(1 − a)², ∂/∂b = 1/(1 − a).
  const mf = b / (1 - a);
  const gradMf = [0, b / (1 - a) ** 2, 1 / (1 - a), ...(fitK ? [0] : [])];
  const varMf = cov ? quadratic(gradMf, cov) : null;
  // t½ and its gradient in (log D, log k) by central differences; interval on the log scale.
  const half = (ld: number, lk: number | null) => recoveryHalfTime(geometry, Math.exp(ld), lk === null ? fixedK : Math.exp(lk));
  const th = half(logD, logK);
  const gradLog = [(Math.log(half(logD + 1e-5, logK)) - Math.log(half(logD - 1e-5, logK))) / 2e-5, 0, 0, ...(fitK ? [(Math.log(half(logD, (logK as number) + 1e-5)) - Math.log(half(logD, (logK as number) - 1e-5))) / 2e-5] : [])];
  const varLogHalf = cov ? quadratic(gradLog, cov) : null;
  const halfTime: ParameterEstimate =
    varLogHalf !== null && varLogHalf >= 0
      ? { value: th, se: th * Math.sqrt(varLogHalf), ci95: [th * Math.exp(-tq * Math.sqrt(varLogHalf)), th * Math.exp(tq * Math.sqrt(varLogHalf))], unit: "s", fixed: false }
      : { value: th, se: null, ci95: null, unit: "s", fixed: false };
  let degradation: ParameterEstimate | null = null;
  if (fitK) {
    const v = cov ? cov[3][3] : null;
    degradation = v !== null && v >= 0 ? { value: k, se: k * Math.sqrt(v), ci95: [k * Math.exp(-tq * Math.sqrt(v)), k * Math.exp(tq * Math.sqrt(v))], unit: "1/s", fixed: false } : { value: k, se: null, ci95: null, unit: "1/s", fixed: false };
  } else if (fixedK > 0) degradation = { value: fixedK, se: null, ci95: null, unit: "1/s", fixed: true };
  const g = shape(logD, logK);
  const fitted = Array.from(g, (gi) => a + b * gi);
  const residuals = fitted.map((f, i) => y[i] - f);
  if (tMax < 3 * th) warnings.push(`the curve stops at ${round(tMax)} s, before 3 half-times (${round(3 * th)} s): the plateau, and with it the mobile fraction and D, are poorly determined; record longer`);
  if (mf > 1.05) warnings.push(`mobile fraction ${mf.toFixed(2)} is above 1: check the background and the acquisition-bleaching correction`);
  if (options.degradation.mode === "none" && geometry.kind !== "rod" && mf > 0 && tMax > 20 * th) warnings.push("turnover was not modelled; if the protein is degraded on the time scale of the recovery, D comes out too high");
  const corr = cov && cov[0][0] > 0 && varMf !== null && varMf > 0 ? quadratic2(gradMf, cov) / Math.sqrt(cov[0][0] * varMf) : NaN;
  return {
    ok: true,
    diffusionUm2PerS: diffusion,
    mobileFraction: parameterEstimate(mf, varMf, tq, ""),
    postBleachIntensity: parameterEstimate(a, cov ? cov[1][1] : null, tq, "normalised"),
    degradationPerS: degradation,
    halfTimeS: halfTime,
    residualSd: Math.sqrt(s2),
    nPoints: n,
    fitted,
    residuals,
    correlationDMobile: corr,
    warnings,
  };
}

function quadratic(g: number[], cov: number[][]): number {
  let s = 0;
  for (let i = 0; i < g.length; i++) for (let j = 0; j < g.length; j++) s += g[i] * cov[i][j] * g[j];
  return s;
}

/** Cov(log D, g·θ): the first row of the covariance against the gradient g. */
function quadratic2(g: number[], cov: number[][]): number {
  let s = 0;
  for (let j = 0; j < g.length; j++) s += cov[0][j] * g[j];
  return s;
}

function round(v: number): string {
  return Number(v.toPrecision(3)).toString();
}
