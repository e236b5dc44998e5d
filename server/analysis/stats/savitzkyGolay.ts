/**
 * Savitzky–Golay smoothing and differentiation of evenly spaced samples: at
 * each point a polynomial of the given order is fitted by least squares to the
 * surrounding window and its value (or derivative) taken there.
 * Source: Savitzky & Golay 1964, Anal Chem 36:1627. Edge handling as in
 * scipy.signal.savgol_filter with mode="interp": the first and last half-windows
 * are evaluated from the polynomial fitted to the first/last full window.
 */
export interface SavitzkyGolayOptions {
  /** Odd number of points in each fitting window, > polynomialOrder and ≤ the number of samples. */
  windowPoints: number;
  /** Order of the fitted polynomial, ≥ 0. */
  polynomialOrder: number;
  /** Which derivative to return: 0 for smoothed values, 1 for the slope, …; 0 by default. */
  derivative?: number;
  /** Spacing between samples (the derivative is per unit of this spacing); 1 by default. */
  spacing?: number;
}

/**
 * Weights w such that Σ_j w_j y_j is the `derivative`-th derivative, at window
 * offset `evaluateAt` (0 … windowPoints−1), of the least-squares polynomial
 * through the window. Computed with a QR factorisation of the Vandermonde
 * matrix on nodes scaled to [−1, 1], which stays well conditioned for wide windows.
 */
export function savitzkyGolayWeights(
  windowPoints: number,
  polynomialOrder: number,
  derivative: number,
  spacing: number,
  evaluateAt: number,
): Float64Array {
  checkSettings(windowPoints, polynomialOrder, derivative, spacing, windowPoints);
  const half = (windowPoints - 1) / 2;
  const scale = Math.max(half, 1);
  const p = polynomialOrder + 1;
  if (derivative > polynomialOrder) return new Float64Array(windowPoints);
  // Columns of the Vandermonde matrix in u = (j − half)/scale, orthonormalised by modified Gram–Schmidt.
  const q: Float64Array[] = [];
  const r: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let k = 0; k < p; k++) {
    const v = new Float64Array(windowPoints);
    for (let j = 0; j < windowPoints; j++) v[j] = ((j - half) / scale) ** k;
    for (let i = 0; i < k; i++) {
      let dot = 0;
      for (let j = 0; j < windowPoints; j++) dot += q[i][j] * v[j];
      r[i][k] = dot;
      for (let j = 0; j < windowPoints; j++) v[j] -= dot * q[i][j];
    }
    let norm = 0;
    for (let j = 0; j < windowPoints; j++) norm += v[j] * v[j];
    norm = Math.sqrt(norm);
    r[k][k] = norm;
    for (let j = 0; j < windowPoints; j++) v[j] /= norm;
    q.push(v);
  }
  // e_k = d^derivative/du^derivative of u^k at the evaluation node.
  const u = (evaluateAt - half) / scale;
  const e = new Array<number>(p).fill(0);
  for (let k = derivative; k < p; k++) {
    let falling = 1;
    for (let m = 0; m < derivative; m++) falling *= k - m;
    e[k] = falling * u ** (k - derivative);
  }
  // Weights = Q R^{-T} e: forward substitution with Rᵀ (lower triangular).
  const y = new Array<number>(p).fill(0);
  for (let k = 0; k < p; k++) {
    let s = e[k];
    for (let i = 0; i < k; i++) s -= r[i][k] * y[i];
    y[k] = s / r[k][k];
  }
  const chain = (1 / (scale * spacing)) ** derivative;
  const w = new Float64Array(windowPoints);
  for (let j = 0; j < windowPoints; j++) {
    let s = 0;
    for (let k = 0; k < p; k++) s += q[k][j] * y[k];
    w[j] = s * chain;
  }
  return w;
}

/**
 * Linear operator form of the filter: for each output point, the index of the
 * first sample in its window and the weights. Applying it to many profiles
 * (e.g. every embryo) reuses one set of weights.
 */
export interface SavitzkyGolayOperator {
  start: Int32Array;
  weights: Float64Array[];
}

export function savitzkyGolayOperator(length: number, options: SavitzkyGolayOptions): SavitzkyGolayOperator {
  const { windowPoints, polynomialOrder } = options;
  const derivative = options.derivative ?? 0;
  const spacing = options.spacing ?? 1;
  checkSettings(windowPoints, polynomialOrder, derivative, spacing, length);
  const half = (windowPoints - 1) / 2;
  const centre = savitzkyGolayWeights(windowPoints, polynomialOrder, derivative, spacing, half);
  const start = new Int32Array(length);
  const weights: Float64Array[] = new Array(length);
  for (let i = 0; i < length; i++) {
    if (i < half) {
      start[i] = 0;
      weights[i] = savitzkyGolayWeights(windowPoints, polynomialOrder, derivative, spacing, i);
    } else if (i >= length - half) {
      start[i] = length - windowPoints;
      weights[i] = savitzkyGolayWeights(windowPoints, polynomialOrder, derivative, spacing, i - (length - windowPoints));
    } else {
      start[i] = i - half;
      weights[i] = centre;
    }
  }
  return { start, weights };
}

/** Apply an operator from {@link savitzkyGolayOperator} to one series of the same length. */
export function applySavitzkyGolay(operator: SavitzkyGolayOperator, values: ArrayLike<number>): Float64Array {
  const n = operator.start.length;
  if (values.length !== n) throw new RangeError(`applySavitzkyGolay: operator is for ${n} samples, got ${values.length}`);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const w = operator.weights[i];
    const s0 = operator.start[i];
    let s = 0;
    for (let j = 0; j < w.length; j++) s += w[j] * values[s0 + j];
    out[i] = s;
  }
  return out;
}

/** Smoothed values or derivative of evenly spaced samples (see {@link SavitzkyGolayOptions}). */
export function savitzkyGolay(values: ArrayLike<number>, options: SavitzkyGolayOptions): Float64Array {
  return applySavitzkyGolay(savitzkyGolayOperator(values.length, options), values);
}

function checkSettings(windowPoints: number, order: number, derivative: number, spacing: number, length: number): void {
  if (!Number.isInteger(windowPoints) || windowPoints < 1 || windowPoints % 2 === 0)
    throw new RangeError(`savitzkyGolay: windowPoints must be a positive odd integer, got ${windowPoints}`);
  if (!Number.isInteger(order) || order < 0 || order >= windowPoints)
    throw new RangeError(`savitzkyGolay: polynomialOrder must be an integer in [0, windowPoints), got ${order} with windowPoints ${windowPoints}`);
  if (!Number.isInteger(derivative) || derivative < 0)
    throw new RangeError(`savitzkyGolay: derivative must be a non-negative integer, got ${derivative}`);
  if (!(spacing > 0) || !Number.isFinite(spacing)) throw new RangeError(`savitzkyGolay: spacing must be a positive number, got ${spacing}`);
  if (windowPoints > length) throw new RangeError(`savitzkyGolay: windowPoints ${windowPoints} exceeds the ${length} samples`);
}
