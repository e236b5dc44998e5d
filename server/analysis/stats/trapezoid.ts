/**
 * Trapezoid-rule weights for samples at ascending positions x, so that
 * ∫ f dx ≈ Σ w_i f(x_i) (numpy.trapezoid / scipy.integrate.trapezoid rule).
 * Reusing the weights makes repeated integrals over one grid cheap.
 */
export function trapezoidWeights(x: ArrayLike<number>): Float64Array {
  const n = x.length;
  const w = new Float64Array(n);
  for (let i = 0; i + 1 < n; i++) {
    const h = x[i + 1] - x[i];
    if (!(h >= 0)) throw new RangeError(`trapezoidWeights: positions must ascend, got ${x[i]} then ${x[i + 1]} at index ${i}`);
    w[i] += h / 2;
    w[i + 1] += h / 2;
  }
  return w;
}

/** ∫ y dx by the trapezoid rule over ascending x. */
export function trapezoid(y: ArrayLike<number>, x: ArrayLike<number>): number {
  if (y.length !== x.length) throw new RangeError(`trapezoid: y has ${y.length} values but x has ${x.length}`);
  const w = trapezoidWeights(x);
  let s = 0;
  for (let i = 0; i < w.length; i++) s += w[i] * y[i];
  return s;
}
