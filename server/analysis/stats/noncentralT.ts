import { incompleteBeta } from "../special/incompleteBeta.ts";
import { logGamma } from "../special/logGamma.ts";
import { normalCdf } from "./normal.ts";

/**
 * CDF of the noncentral t distribution with ν degrees of freedom and
 * noncentrality δ, by the Poisson-mixture series
 *   F(t) = Φ(−δ) + ½ Σ_j [p_j I_x(j + ½, ν/2) + q_j I_x(j + 1, ν/2)],  x = t²/(t² + ν),
 *   p_j = e^{−δ²/2}(δ²/2)^j / j!,  q_j = δ e^{−δ²/2}(δ²/2)^j / (√2 Γ(j + 3/2)),
 * for t ≥ 0, and F(t; ν, δ) = 1 − F(−t; ν, −δ) for t < 0.
 * Source: Lenth 1989, Appl Stat 38:185–189 (algorithm AS 243).
 * Weights are formed in log space so that large δ does not underflow.
 */
export function noncentralTCdf(t: number, df: number, ncp: number): number {
  if (!(df > 0)) throw new RangeError(`noncentralTCdf: degrees of freedom must be > 0, got ${df}`);
  if (!Number.isFinite(ncp)) throw new RangeError(`noncentralTCdf: noncentrality must be finite, got ${ncp}`);
  if (Number.isNaN(t)) throw new RangeError("noncentralTCdf: t is NaN");
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  if (t < 0) return 1 - upperSeries(-t, df, -ncp);
  return upperSeries(t, df, ncp);
}

function upperSeries(t: number, df: number, ncp: number): number {
  const x = (t * t) / (t * t + df);
  const half = (ncp * ncp) / 2;
  let total = normalCdf(-ncp);
  if (x === 0) return total;
  const logHalf = half > 0 ? Math.log(half) : -Infinity;
  const sign = ncp < 0 ? -1 : 1;
  const qScale = Math.abs(ncp) / Math.SQRT2;
  const peak = Math.ceil(half);
  let sum = 0;
  for (let j = 0; j < 100000; j++) {
    const logPois = -half + (j === 0 ? 0 : j * logHalf) - logGamma(j + 1);
    const p = Math.exp(logPois);
    const q = qScale === 0 ? 0 : sign * Math.exp(Math.log(qScale) - half + (j === 0 ? 0 : j * logHalf) - logGamma(j + 1.5));
    const term = p * incompleteBeta(x, j + 0.5, df / 2) + q * incompleteBeta(x, j + 1, df / 2);
    sum += term;
    // Past the Poisson mode the weights fall monotonically; stop once they are negligible.
    if (j > peak && p + Math.abs(q) < 1e-17) break;
  }
  total += 0.5 * sum;
  return Math.min(1, Math.max(0, total));
}
