/**
 * Holm's step-down adjusted p-values for a family of m tests, in the order
 * given. Sorting p ascending, p̃(i) = min(1, max_{j ≤ i} (m − j + 1)·p(j)); the
 * running maximum keeps the adjusted values monotone in the raw ones, so a
 * hypothesis is rejected at level α exactly when Holm's sequential procedure
 * rejects it. Source: Holm 1979, Scand J Stat 6:65–70; adjusted-p form:
 * Wright 1992, Biometrics 48:1005–1013.
 */
export function holmAdjust(pValues: ArrayLike<number>): number[] {
  const m = pValues.length;
  for (let i = 0; i < m; i++) {
    const p = pValues[i];
    if (!(p >= 0 && p <= 1)) throw new RangeError(`holmAdjust: p-value ${i} must be in [0, 1], got ${p}`);
  }
  // Stable sort keeps tied p-values in input order; ties get equal adjusted values anyway.
  const order = Array.from({ length: m }, (_, i) => i).sort((i, j) => pValues[i] - pValues[j]);
  const adjusted = new Array<number>(m);
  let runningMax = 0;
  for (let rank = 0; rank < m; rank++) {
    const i = order[rank];
    runningMax = Math.max(runningMax, Math.min(1, (m - rank) * pValues[i]));
    adjusted[i] = runningMax;
  }
  return adjusted;
}
