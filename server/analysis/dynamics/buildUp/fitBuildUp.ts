import { brentMinimize } from "../../fit/brentMinimize.ts";
import type { ParameterEstimate } from "../../fit/parameterEstimate.ts";
import { parameterEstimate } from "../../fit/parameterEstimate.ts";
import { tQuantile95 } from "../../fit/tQuantile95.ts";
import { solveLinear } from "../../linalg/solveLinear.ts";
import { levenbergMarquardt, sandwichCovariance } from "../leastSquares.ts";
import { accumulationTimes } from "../solver/accumulationTimes.ts";
import { cellValueAt } from "../solver/cellValueAt.ts";
import { SolverSettings } from "../solver/solverSettings.ts";
import { accumulationTime } from "./accumulationTime.ts";
import type { BuildUpFitOptions } from "./buildUpFitOptions.ts";
import { buildUpResponse, type BuildUpData } from "./buildUpResponse.ts";

export interface ProfileLikelihoodPoint {
  degradationPerS: number;
  /** Best D (µm²/s) at this k. */
  diffusionUm2PerS: number;
  /** −2·log-likelihood above the minimum (σ profiled out): n·ln(RSS_k/RSS_min). */
  deviance: number;
}

export interface BuildUpFit {
  ok: true;
  diffusionUm2PerS: ParameterEstimate;
  degradationPerS: ParameterEstimate;
  /** j0 (calibrated: concentration·µm/s) or the amplitude in a.u.·µm/s; ν for a source region. */
  sourceStrength: ParameterEstimate;
  background: ParameterEstimate | null;
  lambdaUm: ParameterEstimate;
  halfLifeS: ParameterEstimate;
  /** Correlation of log D and log k from the fit's covariance. */
  correlationDK: number;
  accumulationTimes: { positionUm: number; timeS: ParameterEstimate }[];
  profileLikelihood: ProfileLikelihoodPoint[];
  /** 95% profile-likelihood interval of k; an end is null when the profile does not rise far enough on that side. */
  profileIntervalK: [number | null, number | null];
  identifiable: boolean;
  residualSd: number;
  nPoints: number;
  fitted: number[];
  warnings: string[];
}

export type BuildUpFitResult = BuildUpFit | { ok: false; reason: string; nPoints: number };

const chi2Crit = 3.841458820694124; // χ²₁ 95% quantile

/**
 * Fit D, k and the source strength (and a background) jointly to profiles
 * taken at several times during the build-up of a gradient, from production
 * onset at t = 0. c(x,t) = j0·u(x,t; D,k) + B with u the unit-source build-up
 * ({@link buildUpResponse}). D and k are fitted on the log scale (their
 * intervals are carried back and stay positive); j0 and B enter linearly and
 * are solved exactly inside the starting grid and the profile likelihood.
 * Covariance HC3 by default (noise grows with intensity; science notes §8) or
 * s²(JᵀJ)⁻¹; the profile likelihood of k
 * (Venzon & Moolgavkar 1988, Appl Stat [value from memory]) shows whether the
 * data separate D from k: before the gradient nears steady state, the
 * build-up fixes D (through the spreading) but hardly k.
 */
export function fitBuildUp(data: BuildUpData, options: BuildUpFitOptions): BuildUpFitResult {
  const n = data.values.length;
  const nLinear = options.background ? 2 : 1;
  const p = 2 + nLinear;
  if (n < p + 5) return { ok: false, reason: `a build-up fit needs at least ${p + 5} points, there are ${n}`, nPoints: n };
  const times = [...new Set(data.tS)];
  if (times.length < 2) return { ok: false, reason: "a build-up fit needs profiles at two or more times; one time point gives only λ", nPoints: n };
  if (data.tS.some((t) => !(t > 0))) return { ok: false, reason: "every profile needs a time after production started (t > 0 s)", nPoints: n };
  const y = data.values;
  const xs = Array.from(data.xUm);
  const xSpan = Math.max(...xs) - Math.min(0, Math.min(...xs)) || 1;
  const tMin = Math.min(...times);
  const tMax = Math.max(...times);

  const cache = new Map<string, Float64Array>();
  const shape = (logD: number, logK: number) => {
    const key = `${logD}|${logK}`;
    let u = cache.get(key);
    if (!u) {
      u = buildUpResponse(data, Math.exp(logD), Math.exp(logK), options);
      if (cache.size > 64) cache.clear();
      cache.set(key, u);
    }
    return u;
  };
  const linear = (u: Float64Array): { j0: number; b: number; ss: number } => {
    let su = 0, suu = 0, sy = 0, suy = 0;
    for (let i = 0; i < n; i++) {
      su += u[i]; suu += u[i] * u[i]; sy += y[i]; suy += u[i] * y[i];
    }
    let j0: number;
    let b = 0;
    if (options.background) {
      const sol = solveLinear([[suu, su], [su, n]], [suy, sy]);
      if (sol === null) return { j0: NaN, b: NaN, ss: Infinity };
      [j0, b] = sol;
    } else j0 = suu > 0 ? suy / suu : NaN;
    let ss = 0;
    for (let i = 0; i < n; i++) ss += (y[i] - j0 * u[i] - b) ** 2;
    return { j0, b, ss: Number.isFinite(ss) ? ss : Infinity };
  };
  const rssAt = (logD: number, logK: number) => linear(shape(logD, logK)).ss;

  // Starting grid: D from x²/t scales, k from the observed times.
  const logDLo = Math.log((xSpan * xSpan) / (1000 * tMax));
  const logDHi = Math.log((1000 * xSpan * xSpan) / tMin);
  const logKLo = Math.log(1e-3 / tMax);
  const logKHi = Math.log(1e2 / tMin);
  const grid = 13;
  let best = { logD: 0, logK: 0, ss: Infinity };
  for (let i = 0; i < grid; i++)
    for (let j = 0; j < grid; j++) {
      const logD = logDLo + ((logDHi - logDLo) * i) / (grid - 1);
      const logK = logKLo + ((logKHi - logKLo) * j) / (grid - 1);
      const ss = rssAt(logD, logK);
      if (ss < best.ss) best = { logD, logK, ss };
    }
  if (!Number.isFinite(best.ss)) return { ok: false, reason: "no starting value fitted the data", nPoints: n };
  const start0 = linear(shape(best.logD, best.logK));
  const lower = [logDLo - 4, logKLo - 4, -Infinity, -Infinity].slice(0, p);
  const upper = [logDHi + 4, logKHi + 4, Infinity, Infinity].slice(0, p);
  const fit = levenbergMarquardt(
    (q) => {
      const u = shape(q[0], q[1]);
      const r = new Float64Array(n);
      const b = options.background ? q[3] : 0;
      for (let i = 0; i < n; i++) r[i] = y[i] - q[2] * u[i] - b;
      return r;
    },
    [best.logD, best.logK, start0.j0, ...(options.background ? [start0.b] : [])],
    lower,
    upper,
  );
  const [logD, logK, j0] = fit.parameters;
  const df = n - p;
  const s2 = fit.sumOfSquares / df;
  const tq = tQuantile95(df);
  const cov = options.covariance === "hc3" ? sandwichCovariance(fit) : (fit.inverseInformation?.map((row) => row.map((v) => v * s2)) ?? null);
  const d = Math.exp(logD);
  const k = Math.exp(logK);
  const warnings: string[] = [];
  if (cov === null) warnings.push("the fit is ill-conditioned: D, k and the source strength cannot be separated from these data; no uncertainties are given");
  const logEstimate = (value: number, grad: number[], unit: string): ParameterEstimate => {
    if (!cov) return { value, se: null, ci95: null, unit, fixed: false };
    let v = 0;
    for (let i = 0; i < grad.length; i++) for (let j = 0; j < grad.length; j++) v += grad[i] * cov[i][j] * grad[j];
    if (!(v >= 0)) return { value, se: null, ci95: null, unit, fixed: false };
    const se = Math.sqrt(v);
    return { value, se: value * se, ci95: [value * Math.exp(-tq * se), value * Math.exp(tq * se)], unit, fixed: false };
  };
  const diffusion = logEstimate(d, [1, 0], "µm²/s");
  const degradation = logEstimate(k, [0, 1], "1/s");
  const lambda = logEstimate(Math.sqrt(d / k), [0.5, -0.5], "µm");
  const halfLife = logEstimate(Math.LN2 / k, [0, -1], "s");
  const strengthUnit = options.source.kind === "region" ? (options.calibrated ? "concentration/s" : "a.u./s") : options.calibrated ? "concentration·µm/s" : "a.u.·µm/s";
  const sourceStrength = parameterEstimate(j0, cov ? cov[2][2] : null, tq, strengthUnit);
  const background = options.background ? parameterEstimate(fit.parameters[3], cov ? cov[3][3] : null, tq, "a.u.") : null;
  const correlationDK = cov ? cov[0][1] / Math.sqrt(cov[0][0] * cov[1][1]) : NaN;

  // τ(x): closed form for the semi-infinite influx model, from the solver otherwise; log-scale delta method.
  const xMaxData = Math.max(...xs);
  const positions = options.accumulationPositionsUm ?? [0, 0.25, 0.5, 0.75, 1].map((f) => f * xMaxData);
  const tauAt = (ld: number, lk: number): number[] => {
    if (options.domain.kind === "semi-infinite" && options.source.kind === "influx") return positions.map((x) => accumulationTime(x, Math.exp(ld), Math.exp(lk)));
    const dd = Math.exp(ld);
    const kk = Math.exp(lk);
    const lam = Math.sqrt(dd / kk);
    const width = options.source.kind === "region" ? options.source.widthUm : 0;
    const lengthUm = options.domain.kind === "finite" ? options.domain.lengthUm : Math.max(xMaxData, width) + 12 * lam;
    const cells = Math.min(4000, Math.max(options.cells, Math.ceil((10 * lengthUm) / Math.min(lam, lengthUm))));
    const prof = accumulationTimes(
      {
        geometry: "line", lengthUm, cells, diffusionUm2PerS: dd, degradationPerS: kk, degradationOrder: 1,
        source: options.source.kind === "region" ? { fromUm: 0, toUm: Math.min(width, lengthUm), ratePerS: 1 } : null,
        left: { kind: "flux", influx: options.source.kind === "influx" ? 1 : 0 }, right: { kind: "flux", influx: 0 }, initial: null,
      },
      SolverSettings.parse({ tolerance: 1e-6 }),
    );
    const h = lengthUm / cells;
    return positions.map((x) => cellValueAt(prof.timesS, x, h));
  };
  const tau0 = tauAt(logD, logK);
  const e = 1e-4;
  const tauDp = tauAt(logD + e, logK), tauDm = tauAt(logD - e, logK), tauKp = tauAt(logD, logK + e), tauKm = tauAt(logD, logK - e);
  const accumulation = positions.map((x, i) => ({
    positionUm: x,
    timeS: logEstimate(tau0[i], [(Math.log(tauDp[i]) - Math.log(tauDm[i])) / (2 * e), (Math.log(tauKp[i]) - Math.log(tauKm[i])) / (2 * e)], "s"),
  }));

  // Profile likelihood of k: for each k, the best D (grid, then Brent) with j0 and B solved linearly.
  const rssMin = fit.sumOfSquares;
  const span = 3.5;
  const profileAt = (lk: number, near: number, reach = 8): ProfileLikelihoodPoint => {
    let bestD = near;
    let bestSs = rssAt(near, lk);
    for (let g = -reach; g <= reach; g++) {
      const ld = near + g * 0.5;
      const ss = rssAt(ld, lk);
      if (ss < bestSs) { bestSs = ss; bestD = ld; }
    }
    const m = brentMinimize((ld) => rssAt(ld, lk), bestD - 0.5, bestD + 0.5, 1e-6, 1e-9, 60);
    if (m.fx < bestSs) { bestSs = m.fx; bestD = m.x; }
    return { degradationPerS: Math.exp(lk), diffusionUm2PerS: Math.exp(bestD), deviance: Math.max(0, n * Math.log(bestSs / rssMin)) };
  };
  const profile: ProfileLikelihoodPoint[] = [];
  for (let i = 0; i < options.profilePoints; i++) profile.push(profileAt(logK - span + (2 * span * i) / (options.profilePoints - 1), logD));
  const centre = profile.reduce((bi, q, i) => (q.deviance < profile[bi].deviance ? i : bi), 0);
  // The crossing of the χ²₁ threshold, bracketed by the grid and refined by bisection on the profile itself.
  const crossing = (dir: -1 | 1): number | null => {
    for (let i = centre; i + dir >= 0 && i + dir < profile.length; i += dir) {
      if (profile[i + dir].deviance < chi2Crit) continue;
      let inside = Math.log(profile[i].degradationPerS);
      let outside = Math.log(profile[i + dir].degradationPerS);
      let near = Math.log(profile[i].diffusionUm2PerS);
      // Ten halvings of a grid step (0.35 in ln k) place the end within 0.04%; D moves little between neighbours.
      for (let it = 0; it < 10; it++) {
        const mid = 0.5 * (inside + outside);
        const q = profileAt(mid, near, 2);
        if (q.deviance < chi2Crit) { inside = mid; near = Math.log(q.diffusionUm2PerS); }
        else outside = mid;
      }
      return Math.exp(0.5 * (inside + outside));
    }
    return null;
  };
  const profileIntervalK: [number | null, number | null] = [crossing(-1), crossing(1)];
  const identifiable = profileIntervalK[0] !== null && profileIntervalK[1] !== null && cov !== null;
  if (!identifiable)
    warnings.push(
      `k is not identified: its profile likelihood stays within the 95% threshold over a ${Math.round(Math.exp(span))}-fold range ` +
        `(D and k trade off along λ = √(D/k) = const). The data end at ${fmt(tMax)} s while the local accumulation time near the source is ${fmt(tau0[0])} s: ` +
        "image the build-up closer to steady state, or measure D independently (FRAP) and combine it with λ",
    );
  else if (tMax < tau0[0]) warnings.push(`the data end at ${fmt(tMax)} s, before the accumulation time near the source (${fmt(tau0[0])} s): k rests on the early build-up; check its profile likelihood`);
  const u = shape(logD, logK);
  const b = options.background ? fit.parameters[3] : 0;
  return {
    ok: true,
    diffusionUm2PerS: diffusion,
    degradationPerS: degradation,
    sourceStrength,
    background,
    lambdaUm: lambda,
    halfLifeS: halfLife,
    correlationDK,
    accumulationTimes: accumulation,
    profileLikelihood: profile,
    profileIntervalK,
    identifiable,
    residualSd: Math.sqrt(s2),
    nPoints: n,
    fitted: Array.from(u, (v) => j0 * v + b),
    warnings,
  };
}

function fmt(v: number): string {
  return Number(v.toPrecision(3)).toString();
}
