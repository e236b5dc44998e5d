import type { Estimate } from "../../estimate.ts";
import { invertSymmetric } from "../../linalg/invertSymmetric.ts";
import { studentTQuantile } from "../../stats/studentT.ts";

/**
 * Saturating approach to a plateau, y = y∞ − (y∞ − y0)·e^(−(t − t0)/τ), with
 * y0 the value at the time origin t0.
 */
export interface SaturatingTrend {
  kind: "saturating";
  converged: boolean;
  /** Why the fit is not usable, when it is not. */
  reason: string | null;
  /** Plateau value y∞. */
  yInf: Estimate | null;
  /** Value at the time origin t0. */
  y0: Estimate | null;
  /** Time constant τ, in the unit of t. */
  tau: Estimate | null;
  /** Fitted y∞ − ŷ(t_last): how far the last observation still is from the plateau. */
  gapAtLast: Estimate | null;
  timeOrigin: number;
  rss: number | null;
  residualSd: number | null;
  n: number;
  df: number;
  level: number;
}

const GRID_POINTS = 120;

/**
 * Nonlinear least squares for the saturating trend by variable projection
 * (Golub & Pereyra 1973, SIAM J Numer Anal): for a given τ the model is linear
 * in (y∞, a) with y = y∞ + a·e^(−(t − t_first)/τ), so the residual sum of
 * squares is minimised over ln τ alone — a grid over [span/200, 20·span]
 * followed by golden-section refinement. Working from the first observed time
 * keeps the linear step well conditioned; y0 at `timeOrigin` follows as
 * y∞ + a·e^((t_first − t0)/τ).
 * Standard errors from s²(JᵀJ)⁻¹, s² = RSS/(n − 3), transformed to (y∞, y0, τ)
 * by the delta method; CIs value ± t_{(1+level)/2, n−3}·SE (Seber & Wild 1989,
 * Nonlinear Regression, ch. 5; matches scipy.optimize.curve_fit).
 * A minimum at the edge of the τ range means the data show no saturation
 * (τ ≫ span: a straight line) or a step (τ ≪ spacing); the fit then reports
 * converged = false with that reason.
 */
export function fitSaturatingTrend(t: ArrayLike<number>, y: ArrayLike<number>, options: { level?: number; timeOrigin?: number } = {}): SaturatingTrend {
  const level = options.level ?? 0.95;
  const timeOrigin = options.timeOrigin ?? 0;
  const n = t.length;
  if (n !== y.length) throw new RangeError(`fitSaturatingTrend: t has ${n} values but y has ${y.length}`);
  const df = n - 3;
  const fail = (reason: string): SaturatingTrend => ({
    kind: "saturating", converged: false, reason, yInf: null, y0: null, tau: null, gapAtLast: null,
    timeOrigin, rss: null, residualSd: null, n, df, level,
  });
  if (n < 4) return fail(`needs at least 4 points, got ${n}`);
  let tFirst = Infinity;
  let tLast = -Infinity;
  for (let i = 0; i < n; i++) {
    tFirst = Math.min(tFirst, t[i]);
    tLast = Math.max(tLast, t[i]);
  }
  if (new Set(Array.from(t)).size < 3) return fail("needs at least 3 distinct times");
  const span = tLast - tFirst;
  const s = Float64Array.from(t, (v) => v - tFirst);

  const lo = Math.log(span / 200);
  const hi = Math.log(span * 20);
  let best = 0;
  let bestRss = Infinity;
  const grid = new Float64Array(GRID_POINTS);
  for (let k = 0; k < GRID_POINTS; k++) {
    grid[k] = lo + ((hi - lo) * k) / (GRID_POINTS - 1);
    const r = projected(s, y, Math.exp(grid[k])).rss;
    if (r < bestRss) {
      bestRss = r;
      best = k;
    }
  }
  if (best === 0) return fail("the best τ is shorter than span/200: the data look like a step, not a gradual approach");
  if (best === GRID_POINTS - 1) return fail("the best τ exceeds 20× the observed span: no saturation is visible (use a linear trend)");

  // Golden-section search on ln τ between the grid neighbours of the best point.
  const g = (Math.sqrt(5) - 1) / 2;
  let a = grid[best - 1];
  let b = grid[best + 1];
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = projected(s, y, Math.exp(c)).rss;
  let fd = projected(s, y, Math.exp(d)).rss;
  for (let i = 0; i < 200 && b - a > 1e-12; i++) {
    if (fc < fd) {
      b = d; d = c; fd = fc;
      c = b - g * (b - a); fc = projected(s, y, Math.exp(c)).rss;
    } else {
      a = c; c = d; fc = fd;
      d = a + g * (b - a); fd = projected(s, y, Math.exp(d)).rss;
    }
  }
  const tau = Math.exp(0.5 * (a + b));
  const { yInf, amp, rss } = projected(s, y, tau);
  if (df < 1) return fail("needs more points than parameters for standard errors");

  // Jacobian in (y∞, a, τ) of y = y∞ + a·e^(−s/τ).
  const jtj = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  for (let i = 0; i < n; i++) {
    const e = Math.exp(-s[i] / tau);
    const row = [1, e, (amp * e * s[i]) / (tau * tau)];
    for (let p = 0; p < 3; p++) for (let q = 0; q < 3; q++) jtj[p][q] += row[p] * row[q];
  }
  const inv = invertSymmetric(jtj);
  const s2 = rss / df;
  const shift = Math.exp((tFirst - timeOrigin) / tau);
  const y0 = yInf + amp * shift;
  const gap = -amp * Math.exp(-span / tau);
  const q = studentTQuantile(0.5 + level / 2, df);
  const est = (value: number, gradient: number[] | null): Estimate => {
    if (!inv || !gradient) return { value, se: null, ci95: null };
    let v = 0;
    for (let p = 0; p < 3; p++) for (let r = 0; r < 3; r++) v += gradient[p] * inv.inverse[p][r] * gradient[r] * s2;
    const se = Math.sqrt(Math.max(0, v));
    return Number.isFinite(se) ? { value, se, ci95: [value - q * se, value + q * se] } : { value, se: null, ci95: null };
  };
  return {
    kind: "saturating",
    converged: true,
    reason: inv ? null : "JᵀJ is ill-conditioned; no standard errors",
    yInf: est(yInf, [1, 0, 0]),
    // y0 = y∞ + a·e^((t_first − t0)/τ): delta-method gradient in (y∞, a, τ).
    y0: est(y0, [1, shift, (-amp * shift * (tFirst - timeOrigin)) / (tau * tau)]),
    tau: est(tau, [0, 0, 1]),
    // y∞ − ŷ(t_last) = −a·e^(−span/τ).
    gapAtLast: est(gap, [0, -Math.exp(-span / tau), (-amp * Math.exp(-span / tau) * span) / (tau * tau)]),
    timeOrigin,
    rss,
    residualSd: Math.sqrt(s2),
    n,
    df,
    level,
  };
}

/** Linear least squares of y on (1, e^(−s/τ)) for fixed τ. */
function projected(s: Float64Array, y: ArrayLike<number>, tau: number): { yInf: number; amp: number; rss: number } {
  const n = s.length;
  const f = new Float64Array(n);
  let mf = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    f[i] = Math.exp(-s[i] / tau);
    mf += f[i];
    my += y[i];
  }
  mf /= n;
  my /= n;
  let sff = 0, sfy = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    const df = f[i] - mf;
    const dy = y[i] - my;
    sff += df * df;
    sfy += df * dy;
    syy += dy * dy;
  }
  if (sff === 0) return { yInf: my, amp: 0, rss: syy };
  const amp = sfy / sff;
  return { yInf: my - amp * mf, amp, rss: Math.max(0, syy - amp * sfy) };
}
