import type { Estimate } from "../../estimate.ts";
import { studentTTwoSidedP } from "../../stats/studentT.ts";
import { fitLinearTrend } from "./linearTrend.ts";
import type { SaturatingTrend } from "./saturatingTrend.ts";

/** Whether a metric still changes at the end of the observed time range. */
export interface SteadyStateAssessment {
  /** True when either rule below fires; false when the rules ran and neither fired; null when none could run. */
  notAtSteadyState: boolean | null;
  /** OLS slope over the late part of the range (per unit of time). */
  lateSlope: Estimate | null;
  /** Two-sided p for a zero late slope. */
  lateSlopeP: number | null;
  /** Points in the late window. */
  lateN: number;
  /** |y∞ − ŷ(t_last)| / |y∞| from the saturating fit, when one converged. */
  remainingFraction: number | null;
  /** Each rule that fired, in words. */
  reasons: string[];
  /** The rule, stated once so the result explains itself. */
  rule: string;
}

export interface SteadyStateOptions {
  /** Late window: the last `lateFraction` of the observed time span. */
  lateFraction: number;
  /** Significance level of the late-slope test. */
  alpha: number;
  /** Largest relative distance from the fitted plateau still called steady. */
  steadyTolerance: number;
}

/**
 * Rule (documented in the result):
 * (1) late slope — fit a straight line to the points in the last
 *     `lateFraction` of the time span (≥ 3 points, ≥ 2 distinct times); if its
 *     slope differs from 0 at level α (t-test on the OLS slope), the metric is
 *     still changing;
 * (2) plateau gap — if a saturating fit converged and its fitted gap
 *     y∞ − ŷ(t_last) differs from 0 at α (t-test with the delta-method SE) and
 *     is more than `steadyTolerance` of |y∞|, the metric has not reached steady
 *     state (equivalently τ is not small against the observed span).
 * Either rule firing sets `notAtSteadyState`. The local accumulation time
 * grows with distance from the source (Berezhkovskii, Sample & Shvartsman
 * 2010, Biophys J), so λ measured early reads too short: compare λ only
 * between embryos at steady state.
 */
export function assessSteadyState(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  saturating: SaturatingTrend | null,
  options: SteadyStateOptions,
): SteadyStateAssessment {
  const rule = `not at steady state when the OLS slope over the last ${round(options.lateFraction * 100)}% of the time span differs from 0 at α = ${options.alpha}, `
    + `or when a converged saturating fit is still significantly and more than ${round(options.steadyTolerance * 100)}% from its plateau at the last time`;
  const reasons: string[] = [];
  let tMin = Infinity;
  let tMax = -Infinity;
  for (let i = 0; i < t.length; i++) {
    tMin = Math.min(tMin, t[i]);
    tMax = Math.max(tMax, t[i]);
  }
  const start = tMax - options.lateFraction * (tMax - tMin);
  const lateT: number[] = [];
  const lateY: number[] = [];
  for (let i = 0; i < t.length; i++) if (t[i] >= start) {
    lateT.push(t[i]);
    lateY.push(y[i]);
  }
  let lateSlope: Estimate | null = null;
  let lateSlopeP: number | null = null;
  let ran = false;
  if (lateT.length >= 3 && new Set(lateT).size >= 2) {
    const fit = fitLinearTrend(lateT, lateY, 1 - options.alpha);
    lateSlope = fit.slope;
    lateSlopeP = fit.pSlope;
    ran = true;
    if (fit.pSlope < options.alpha) reasons.push(`the late slope ${fmt(fit.slope.value)} per unit time differs from 0 (p = ${fmt(fit.pSlope)})`);
  }
  let remainingFraction: number | null = null;
  if (saturating?.converged && saturating.yInf && saturating.gapAtLast && saturating.y0) {
    ran = true;
    remainingFraction = saturating.yInf.value === 0 ? null : Math.abs(saturating.gapAtLast.value / saturating.yInf.value);
    const approachSignificant = saturating.gapAtLast.se !== null && saturating.gapAtLast.se > 0
      ? studentTTwoSidedP(saturating.gapAtLast.value / saturating.gapAtLast.se, saturating.df) < options.alpha
      : false;
    if (approachSignificant && remainingFraction !== null && remainingFraction > options.steadyTolerance) {
      reasons.push(`the saturating fit is still ${fmt(remainingFraction * 100)}% from its plateau at the last time (τ = ${fmt(saturating.tau?.value ?? NaN)})`);
    }
  }
  return {
    notAtSteadyState: ran ? reasons.length > 0 : null,
    lateSlope,
    lateSlopeP,
    lateN: lateT.length,
    remainingFraction,
    reasons,
    rule,
  };
}

function round(v: number): number {
  return Math.round(v * 10) / 10;
}

function fmt(v: number): string {
  return Number(v.toPrecision(3)).toString();
}
