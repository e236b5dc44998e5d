import type { SteadyStateModel } from "../models/steadyStateModel.ts";
import { acquireArrays, releaseArrays } from "./workspacePool.ts";

/**
 * One profile of a separable least-squares problem y ≈ A·g(x; θ) + B, with
 * preallocated work arrays so that evaluating it allocates nothing.
 *
 * For given θ the linear parameters (A, and B when fitted) are the weighted
 * least-squares solution; what remains is the variable-projection residual
 * r(θ) = P⊥(θ)·√w·y (Golub & Pereyra 1973, SIAM J Numer Anal). Its Jacobian
 * is taken in Kaufman's form J_j = −P⊥·t_j with t_j = √w·A·∂g/∂θ_j
 * (Kaufman 1975, BIT); the gradient Jᵀr = −t_jᵀr is then exact, because
 * the term Kaufman drops is orthogonal to r.
 *
 * Everything the minimiser and the covariance need is a weighted sum over
 * the points, so an evaluation is one pass for the basis, one for the sums
 * and one for the residual. With a background the basis is centred
 * (projecting out the constant column first), i.e. a two-column QR in
 * closed form; sums of g are shifted by a sample value of g to avoid
 * cancellation (the "shifted data" algorithm: Chan, Golub & LeVeque 1983,
 * Am Stat).
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
  /** Number of nonlinear model parameters (free or fixed). */
  readonly parameterCount: number;

  /** Current point weights and their square roots. */
  readonly weights: Float64Array;
  readonly sqrtWeights: Float64Array;
  private sumW = 0;
  private meanY = 0;

  /** Basis g(x; θ) and ∂g/∂θ_j at the last evaluation (unweighted). */
  readonly basisValues: Float64Array;
  readonly basisDerivatives: Float64Array[];
  /** Weighted residual √w·(y − A·g − B) at the last evaluation. */
  readonly residual: Float64Array;

  private readonly workArrays: Float64Array[];
  /** Σw·∂g_j (index j over model parameters). */
  private readonly sumD: Float64Array;
  /** Σw·∂g_j·(g − shift). */
  private readonly sumDG: Float64Array;
  /** Σw·∂g_j·∂g_k (row-major, parameterCount²). */
  private readonly sumDD: Float64Array;
  /** Σw·∂g_j·r (unweighted residual r). */
  private readonly sumDR: Float64Array;

  amplitude = 0;
  background = 0;
  rss = 0;
  /** Shift subtracted from g in the sums, its weighted mean ḡ, and Σw(g − ḡ)² (Σw·g² without background). */
  private shift = 0;
  private gMean = 0;
  private gSpread = 0;
  /** Inverse of the weighted Gram matrix ΦᵀΦ of the linear basis [g, 1]: entries 00, 01, 11. */
  gramInverse00 = 0;
  gramInverse01 = 0;
  gramInverse11 = 0;
  /** Squared cosine between the weighted basis column and the background column (0 without background). */
  cosineSquared = 0;

  constructor(x: Float64Array, y: Float64Array, lengthUm: number, fitBackground: boolean, parameterCount: number) {
    if (x.length !== y.length) throw new RangeError(`SeparableBlock: x has ${x.length} values but y has ${y.length}`);
    const n = x.length;
    this.n = n;
    this.x = x;
    this.y = y;
    this.lengthUm = lengthUm;
    this.fitBackground = fitBackground;
    this.linearCount = fitBackground ? 2 : 1;
    this.parameterCount = parameterCount;
    // Per-point work arrays come from a pool: allocating typed arrays costs
    // as much as a few passes over the data (see workspacePool.ts).
    this.workArrays = acquireArrays(n, 4 + parameterCount);
    const [weights, sqrtWeights, basisValues, residual, ...derivatives] = this.workArrays;
    this.weights = weights.fill(1);
    this.sqrtWeights = sqrtWeights.fill(1);
    this.basisValues = basisValues;
    this.residual = residual;
    this.basisDerivatives = derivatives;
    this.sumD = new Float64Array(parameterCount);
    this.sumDG = new Float64Array(parameterCount);
    this.sumDD = new Float64Array(parameterCount * parameterCount);
    this.sumDR = new Float64Array(parameterCount);
    this.refreshWeightSums();
  }

  /** Replace the point weights (all must be positive and finite). */
  setWeights(weights: ArrayLike<number>): void {
    for (let i = 0; i < this.n; i++) {
      this.weights[i] = weights[i];
      this.sqrtWeights[i] = Math.sqrt(weights[i]);
    }
    this.refreshWeightSums();
  }

  private refreshWeightSums(): void {
    let sw = 0;
    let swy = 0;
    for (let i = 0; i < this.n; i++) {
      sw += this.weights[i];
      swy += this.weights[i] * this.y[i];
    }
    this.sumW = sw;
    this.meanY = swy / sw;
  }

  /**
   * Solve the linear parameters at θ and the residual; with `free` given,
   * also the sums behind the Jacobian of those nonlinear parameters.
   * Returns false when the basis is degenerate or not finite at θ.
   */
  evaluate(model: SteadyStateModel, theta: Float64Array, free: Int32Array | null): boolean {
    const n = this.n;
    const g = this.basisValues;
    const w = this.weights;
    const y = this.y;
    model.basis(this.x, theta, this.lengthUm, g, free === null ? null : this.basisDerivatives);

    let amplitude: number;
    let background = 0;
    // Shift for the sums of g: a sample value near the middle of the profile.
    const shift = this.fitBackground ? g[n >> 1] : 0;
    if (this.fitBackground) {
      const my = this.meanY;
      let sg = 0;
      let sgg = 0;
      let sgy = 0;
      for (let i = 0; i < n; i++) {
        const d = g[i] - shift;
        const wd = w[i] * d;
        sg += wd;
        sgg += wd * d;
        sgy += wd * (y[i] - my);
      }
      const sw = this.sumW;
      // Centred Σw(g − ḡ)²; Σw(g − ḡ)(y − ȳ) equals sgy because Σw(y − ȳ) = 0.
      const cgg = sgg - (sg * sg) / sw;
      const gMean = shift + sg / sw;
      const sumG2 = cgg + sw * gMean * gMean;
      if (!(cgg > 1e-26 * sumG2) || !Number.isFinite(sumG2)) return false;
      amplitude = sgy / cgg;
      background = my - amplitude * gMean;
      this.gMean = gMean;
      this.gSpread = cgg;
      this.gramInverse00 = 1 / cgg;
      this.gramInverse01 = -gMean / cgg;
      this.gramInverse11 = 1 / sw + (gMean * gMean) / cgg;
      this.cosineSquared = 1 - cgg / sumG2;
    } else {
      let sgg = 0;
      let sgy = 0;
      for (let i = 0; i < n; i++) {
        const wg = w[i] * g[i];
        sgg += wg * g[i];
        sgy += wg * y[i];
      }
      if (!(sgg > 0) || !Number.isFinite(sgg)) return false;
      amplitude = sgy / sgg;
      this.gMean = 0;
      this.gSpread = sgg;
      this.gramInverse00 = 1 / sgg;
      this.gramInverse01 = 0;
      this.gramInverse11 = 0;
      this.cosineSquared = 0;
    }
    if (!Number.isFinite(amplitude) || !Number.isFinite(background)) return false;
    this.shift = shift;
    this.amplitude = amplitude;
    this.background = background;

    // Residual pass; with derivatives, also their sums.
    const res = this.residual;
    const sqw = this.sqrtWeights;
    let rss = 0;
    const freeCount = free === null ? 0 : free.length;
    if (freeCount === 1 && free !== null) {
      const j = free[0];
      const d0 = this.basisDerivatives[j];
      let sd = 0;
      let sdg = 0;
      let sdd = 0;
      let sdr = 0;
      for (let i = 0; i < n; i++) {
        const r = y[i] - amplitude * g[i] - background;
        const wi = w[i];
        res[i] = sqw[i] * r;
        rss += wi * r * r;
        const wd = wi * d0[i];
        sd += wd;
        sdg += wd * (g[i] - shift);
        sdd += wd * d0[i];
        sdr += wd * r;
      }
      this.sumD[j] = sd;
      this.sumDG[j] = sdg;
      this.sumDD[j * this.parameterCount + j] = sdd;
      this.sumDR[j] = sdr;
    } else {
      for (let i = 0; i < n; i++) {
        const r = y[i] - amplitude * g[i] - background;
        res[i] = sqw[i] * r;
        rss += w[i] * r * r;
      }
      if (free !== null) {
        const P = this.parameterCount;
        for (let a = 0; a < freeCount; a++) {
          const j = free[a];
          const dj = this.basisDerivatives[j];
          let sd = 0;
          let sdg = 0;
          let sdr = 0;
          for (let i = 0; i < n; i++) {
            const wd = w[i] * dj[i];
            sd += wd;
            sdg += wd * (g[i] - shift);
            sdr += wd * (y[i] - amplitude * g[i] - background);
          }
          this.sumD[j] = sd;
          this.sumDG[j] = sdg;
          this.sumDR[j] = sdr;
          for (let b = 0; b <= a; b++) {
            const k = free[b];
            const dk = this.basisDerivatives[k];
            let sdd = 0;
            for (let i = 0; i < n; i++) sdd += w[i] * dj[i] * dk[i];
            this.sumDD[j * P + k] = sdd;
            this.sumDD[k * P + j] = sdd;
          }
        }
      }
    }
    this.rss = rss;
    return Number.isFinite(rss);
  }

  /**
   * C_j = (ΦᵀΦ)⁻¹ΦᵀT_j for model parameter j: how the least-squares amplitude
   * (out[0]) and background (out[1]) move per unit change of θ_j, in the
   * weighted basis. Computed from centred sums for stability. Valid after an
   * evaluation with j free.
   */
  linearSensitivity(j: number, out: Float64Array): void {
    // Σw·∂g_j·(g − ḡ), with ∂g_j scaled by A as in T_j.
    const centred = this.amplitude * (this.sumDG[j] - (this.gMean - this.shift) * this.sumD[j]);
    const c0 = centred / this.gSpread;
    out[0] = c0;
    out[1] = this.fitBackground ? (this.amplitude * this.sumD[j]) / this.sumW - this.gMean * c0 : 0;
  }

  /**
   * Add this block's Kaufman Gram matrix JᵀJ = Tᵀ P⊥ T and gradient
   * Jᵀr = −Tᵀr over the free parameters into `jtj` (free × free, row-major)
   * and `jtr`. With a background, P⊥ removes the constant and the centred
   * basis g − ḡ: Tᵀ P⊥ T = TᵀT − (ΣwT_j)(ΣwT_k)/Σw − (T_jᵀ(g − ḡ))(T_kᵀ(g − ḡ))/Σw(g − ḡ)².
   */
  accumulate(free: Int32Array, jtj: Float64Array, jtr: Float64Array): void {
    const p = free.length;
    const P = this.parameterCount;
    const a2 = this.amplitude * this.amplitude;
    const offset = this.gMean - this.shift;
    const bg = this.fitBackground;
    for (let a = 0; a < p; a++) {
      const j = free[a];
      jtr[a] += -this.amplitude * this.sumDR[j];
      const cj = this.sumDG[j] - offset * this.sumD[j];
      for (let b = 0; b < p; b++) {
        const k = free[b];
        const ck = this.sumDG[k] - offset * this.sumD[k];
        let projected = (cj * ck) / this.gSpread;
        if (bg) projected += (this.sumD[j] * this.sumD[k]) / this.sumW;
        jtj[a * p + b] += a2 * (this.sumDD[j * P + k] - projected);
      }
    }
  }

  /** Give the work arrays back to the pool; the block must not be used afterwards. */
  release(): void {
    releaseArrays(this.workArrays);
  }

  /** Fitted intensity A·g + B (a fixed background, subtracted from y, is not included). */
  fittedValues(out: Float64Array): Float64Array {
    for (let i = 0; i < this.n; i++) out[i] = this.amplitude * this.basisValues[i] + this.background;
    return out;
  }
}
