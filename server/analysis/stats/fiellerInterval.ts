import { mean, variance } from "./descriptive.ts";
import { studentTQuantile } from "./studentT.ts";

/** Fieller's interval for a ratio of two independent means. */
export interface FiellerInterval {
  /** mean(a)/mean(b). */
  value: number;
  /** The interval at `level`; null when it is unbounded (see `reason`). */
  interval: [number, number] | null;
  /** Why there is no bounded interval: the mean of b is not clearly different from 0. */
  reason: string | null;
}

/**
 * Fieller's confidence set for ρ = μa/μb from two independent samples: every ρ
 * for which the hypothesis μa − ρ·μb = 0 is not rejected by Welch's test of a
 * against ρ·b, i.e. (ā − ρ b̄)² ≤ t²_{1−α/2, ν(ρ)}·(s²a/na + ρ² s²b/nb), with
 * ν(ρ) the Welch–Satterthwaite degrees of freedom of that combination.
 * Source: Fieller 1954, J R Stat Soc B 16:175–185 (the pivot); Welch 1947,
 * Biometrika (the degrees of freedom for unequal variances).
 * At ρ = 1 the pivot is Welch's t itself, so the interval excludes 1 exactly
 * when Welch's p is below 1 − level. The set is a bounded interval only when
 * b̄ is clearly non-zero (b̄²/(s²b/nb) > t²_{1−α/2, nb−1}); otherwise it is
 * unbounded and no interval is given. Because ν depends on ρ, each endpoint
 * is the fixed point of "solve the quadratic with t at ν(ρ)", with
 * bracketing and bisection as a fallback.
 */
export function fiellerInterval(a: ArrayLike<number>, b: ArrayLike<number>, level: number): FiellerInterval {
  const na = a.length;
  const nb = b.length;
  if (na < 2 || nb < 2) throw new RangeError(`fiellerInterval: each sample needs at least 2 values, got ${na} and ${nb}`);
  const ma = mean(a);
  const mb = mean(b);
  if (mb === 0) return { value: NaN, interval: null, reason: "the mean of the second group is 0" };
  const r = ma / mb;
  const va = variance(a) / na;
  const vb = variance(b) / nb;
  const p = 0.5 + level / 2;
  if (va === 0 && vb === 0) return { value: r, interval: [r, r], reason: null };
  if (vb > 0 && (mb * mb) / vb <= studentTQuantile(p, nb - 1) ** 2) {
    return { value: r, interval: null, reason: "the mean of the second group is not clearly different from 0, so the ratio has no bounded interval" };
  }
  const quantile = (rho: number): number => {
    const v = va + rho * rho * vb;
    const den = (va * va) / (na - 1) + (rho ** 4 * vb * vb) / (nb - 1);
    return studentTQuantile(p, den > 0 ? (v * v) / den : Math.max(1, Math.min(na, nb) - 1));
  };
  const g = (rho: number): number => (ma - rho * mb) ** 2 - quantile(rho) ** 2 * (va + rho * rho * vb);
  // Fast path: with q fixed the endpoints solve a quadratic; iterate q(ρ) to its fixed point.
  const fixedPoint = (sign: 1 | -1): number | null => {
    let rho = r;
    for (let i = 0; i < 60; i++) {
      const q2 = quantile(rho) ** 2;
      const lead = mb * mb - q2 * vb;
      const disc = q2 * (ma * ma * vb + mb * mb * va - q2 * va * vb);
      if (!(lead > 0) || !(disc >= 0)) return null;
      // The lower endpoint takes −√disc when lead > 0 (roots ordered by sign of the square root).
      const next = (ma * mb + sign * Math.sqrt(disc)) / lead;
      if (Math.abs(next - rho) <= 1e-13 * Math.max(1, Math.abs(next))) return next;
      rho = next;
    }
    return null;
  };
  const scale = Math.max(Math.abs(r), Math.sqrt(va + vb) / Math.abs(mb), 1e-300);
  const root = (direction: 1 | -1): number => {
    let inside = r;
    let step = scale * 1e-3;
    let outside = r + direction * step;
    while (g(outside) < 0) {
      inside = outside;
      step *= 2;
      outside = r + direction * step;
      if (!Number.isFinite(outside)) throw new Error("fiellerInterval: no endpoint found although the set should be bounded");
    }
    for (let i = 0; i < 200 && Math.abs(outside - inside) > 1e-12 * Math.max(1, Math.abs(r)); i++) {
      const mid = 0.5 * (inside + outside);
      if (g(mid) < 0) inside = mid;
      else outside = mid;
    }
    return 0.5 * (inside + outside);
  };
  return { value: r, interval: [fixedPoint(-1) ?? root(-1), fixedPoint(1) ?? root(1)], reason: null };
}
