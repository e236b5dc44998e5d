import type { SteadyStateModel } from "../models/steadyStateModel.ts";

/**
 * One profile of a separable least-squares problem y ≈ A·g(x; θ) + B, with
 * preallocated work arrays so that evaluating it allocates nothing.
 *
 * For given θ the linear parameters (A, and B when fitted) are the weighted
 * least-squares solution, found through a thin QR factorisation of the
 * weighted basis [√w·g, √w] by Gram–Schmidt with one reorthogonalisation
 * ("twice is enough": Giraud, Langou, Rozložník 2005, Comput Math Appl).
 * What remains is the variable-projection residual r(θ) = P⊥(θ)·√w·y
 * (Golub & Pereyra 1973, SIAM J Numer Anal) and Kaufman's approximation of
 * its Jacobian, ∂r/∂θ_j ≈ −P⊥·(∂Φ/∂θ_j)·α (Kaufman 1975, BIT).
 *
 * The same pieces give the full covariance of (θ, A, B) at the solution by a
 * Schur complement (see blockCovariance.ts), so one block per embryo also
 * serves the global fit, where θ is shared and A, B belong to each embryo.
 */
export class SeparableBlock {
  readonly n: number;
  readonly x: Float64Array;
  /** Intensities after subtracting a fixed background (unweighted). */
  readonly y: Float64Array;
  /** Embryo length (µm); Infinity on a semi-infinite domain. */
  readonly lengthUm: number;
  readonly fitBackground: boolean;
  /** Number of linear parameters: 1 (amplitude) or 2 (amplitude, background). */
  readonly linearCount: number;

  /** Current point weights and their square roots. */
  readonly weights: Float64Array;
  readonly sqrtWeights: Float64Array;
  private readonly yWeighted: Float64Array;

  /** Basis g(x; θ) and ∂g/∂θ_j at the last evaluation (unweighted). */
  readonly basisValues: Float64Array;
  readonly basisDerivatives: Float64Array[];
  /** Orthonormal columns spanning the weighted basis. */
  private readonly q0: Float64Array;
  private readonly q1: Float64Array;
  /** Weighted residual √w·(y − A·g − B) at the last evaluation. */
  readonly residual: Float64Array;
  /** Unprojected weighted model derivatives t_j = √w·∂g/∂θ_j·A. */
  readonly modelDerivatives: Float64Array[];
  /** Kaufman Jacobian columns −P⊥·t_j. */
  readonly projectedJacobian: Float64Array[];
  /** Qᵀt_j for each nonlinear parameter j (row-major, linearCount entries per j). */
  readonly qtDerivatives: Float64Array;

  /** Upper-triangular R of the QR factorisation: [r00 r01; 0 r11]. */
  r00 = 0;
  r01 = 0;
  r11 = 0;
  amplitude = 0;
  background = 0;
  rss = 0;

  constructor(x: Float64Array, y: Float64Array, lengthUm: number, fitBackground: boolean, parameterCount: number) {
    if (x.length !== y.length) throw new RangeError(`SeparableBlock: x has ${x.length} values but y has ${y.length}`);
    const n = x.length;
    this.n = n;
    this.x = x;
    this.y = y;
    this.lengthUm = lengthUm;
    this.fitBackground = fitBackground;
    this.linearCount = fitBackground ? 2 : 1;
    this.weights = new Float64Array(n).fill(1);
    this.sqrtWeights = new Float64Array(n).fill(1);
    this.yWeighted = Float64Array.from(y);
    this.basisValues = new Float64Array(n);
    this.basisDerivatives = Array.from({ length: parameterCount }, () => new Float64Array(n));
    this.q0 = new Float64Array(n);
    this.q1 = new Float64Array(n);
    this.residual = new Float64Array(n);
    this.modelDerivatives = Array.from({ length: parameterCount }, () => new Float64Array(n));
    this.projectedJacobian = Array.from({ length: parameterCount }, () => new Float64Array(n));
    this.qtDerivatives = new Float64Array(parameterCount * 2);
  }

  /** Replace the point weights (all must be positive and finite). */
  setWeights(weights: ArrayLike<number>): void {
    for (let i = 0; i < this.n; i++) {
      const w = weights[i];
      this.weights[i] = w;
      const s = Math.sqrt(w);
      this.sqrtWeights[i] = s;
      this.yWeighted[i] = s * this.y[i];
    }
  }

  /**
   * Solve the linear parameters at θ, and the residual; with `free` given,
   * also the Kaufman Jacobian columns for those nonlinear parameters.
   * Returns false when the basis is degenerate or not finite at θ.
   */
  evaluate(model: SteadyStateModel, theta: Float64Array, free: Int32Array | null): boolean {
    const n = this.n;
    const g = this.basisValues;
    model.basis(this.x, theta, this.lengthUm, g, free === null ? null : this.basisDerivatives);
    const sw = this.sqrtWeights;
    const q0 = this.q0;
    const q1 = this.q1;

    // First column: √w·g, normalised. Rescale when its squares would underflow.
    let ss = 0;
    for (let i = 0; i < n; i++) {
      const c = sw[i] * g[i];
      q0[i] = c;
      ss += c * c;
    }
    if (!Number.isFinite(ss)) return false;
    let r00: number;
    if (ss < 1e-280) {
      let big = 0;
      for (let i = 0; i < n; i++) big = Math.max(big, Math.abs(q0[i]));
      if (!(big > 0)) return false;
      let scaled = 0;
      for (let i = 0; i < n; i++) scaled += (q0[i] / big) ** 2;
      r00 = big * Math.sqrt(scaled);
    } else {
      r00 = Math.sqrt(ss);
    }
    const inv00 = 1 / r00;
    for (let i = 0; i < n; i++) q0[i] *= inv00;
    this.r00 = r00;

    // Second column: the constant background √w, orthogonalised twice against q0.
    let z1 = 0;
    if (this.fitBackground) {
      let d = 0;
      let c1Norm2 = 0;
      for (let i = 0; i < n; i++) {
        d += q0[i] * sw[i];
        c1Norm2 += sw[i] * sw[i];
      }
      let d2 = 0;
      for (let i = 0; i < n; i++) {
        const v = sw[i] - d * q0[i];
        q1[i] = v;
        d2 += q0[i] * v;
      }
      let vv = 0;
      for (let i = 0; i < n; i++) {
        const v = q1[i] - d2 * q0[i];
        q1[i] = v;
        vv += v * v;
      }
      const r11 = Math.sqrt(vv);
      // Basis and background indistinguishable (e.g. an exponential far flatter than the window).
      if (!(r11 > 1e-13 * Math.sqrt(c1Norm2))) return false;
      this.r01 = d + d2;
      this.r11 = r11;
      const inv11 = 1 / r11;
      for (let i = 0; i < n; i++) q1[i] *= inv11;
    } else {
      this.r01 = 0;
      this.r11 = 0;
    }

    // Linear parameters from Qᵀ(√w·y) and back-substitution in R.
    const yw = this.yWeighted;
    let z0 = 0;
    for (let i = 0; i < n; i++) z0 += q0[i] * yw[i];
    if (this.fitBackground) for (let i = 0; i < n; i++) z1 += q1[i] * yw[i];
    const background = this.fitBackground ? z1 / this.r11 : 0;
    const amplitude = (z0 - this.r01 * background) / r00;
    this.amplitude = amplitude;
    this.background = background;

    const res = this.residual;
    let rss = 0;
    if (this.fitBackground) {
      for (let i = 0; i < n; i++) {
        const r = yw[i] - z0 * q0[i] - z1 * q1[i];
        res[i] = r;
        rss += r * r;
      }
    } else {
      for (let i = 0; i < n; i++) {
        const r = yw[i] - z0 * q0[i];
        res[i] = r;
        rss += r * r;
      }
    }
    this.rss = rss;
    if (!Number.isFinite(rss) || !Number.isFinite(amplitude) || !Number.isFinite(background)) return false;

    if (free !== null) {
      for (let k = 0; k < free.length; k++) {
        const j = free[k];
        const dg = this.basisDerivatives[j];
        const t = this.modelDerivatives[j];
        const jac = this.projectedJacobian[j];
        let a = 0;
        let b = 0;
        for (let i = 0; i < n; i++) {
          const v = sw[i] * dg[i] * amplitude;
          t[i] = v;
          a += q0[i] * v;
        }
        if (this.fitBackground) {
          for (let i = 0; i < n; i++) b += q1[i] * t[i];
          for (let i = 0; i < n; i++) jac[i] = -(t[i] - a * q0[i] - b * q1[i]);
        } else {
          for (let i = 0; i < n; i++) jac[i] = -(t[i] - a * q0[i]);
        }
        this.qtDerivatives[2 * j] = a;
        this.qtDerivatives[2 * j + 1] = b;
      }
    }
    return true;
  }

  /** Fitted intensity A·g + B (plus nothing for a fixed background, which the caller adds back). */
  fittedValues(out: Float64Array): Float64Array {
    for (let i = 0; i < this.n; i++) out[i] = this.amplitude * this.basisValues[i] + this.background;
    return out;
  }
}
