import { invertSymmetric } from "../linalg/invertSymmetric.ts";
import type { Matrix } from "../linalg/matrix.ts";
import type { ProjectedProblem } from "./projectedProblem.ts";

export interface BlockCovariance {
  /** Covariance of the free nonlinear parameters (free × free). */
  nonlinear: Matrix;
  /** Per block: covariance of its linear parameters [amplitude, background?]. */
  linear: Matrix[];
  /** Per block: covariance between its linear parameters (rows) and the free nonlinear ones (columns). */
  cross: Matrix[];
  /** Condition number of the (unit-diagonal scaled) reduced Gram matrix. */
  conditionNumber: number;
}

/**
 * Full covariance s²(JᵀJ)⁻¹ of every fitted parameter at the solution held
 * by `problem`, without forming JᵀJ over all blocks. With T the weighted
 * model derivatives for θ and Φ the weighted linear basis [g, 1] of each block,
 * block inversion of JᵀJ = [TᵀT TᵀΦ; ΦᵀT ΦᵀΦ] gives
 *   Cov(θ)    = s² S⁻¹,                     S = Σ_b (P⊥T_b)ᵀ(P⊥T_b)
 *   Cov(α, θ) = −s² C S⁻¹,                  C = (ΦᵀΦ)⁻¹ΦᵀT_b
 *   Cov(α)    = s² ((ΦᵀΦ)⁻¹ + C S⁻¹ Cᵀ)
 * where S, the Schur complement, is exactly the Kaufman Gram matrix the
 * minimiser already accumulated. Source: block matrix inverse via the Schur
 * complement (Golub & Van Loan, Matrix Computations, §3.2); covariance
 * s²(JᵀJ)⁻¹ of nonlinear least squares (Seber & Wild 1989, Nonlinear
 * Regression, §2.1). Returns null when S or a block's basis is singular or
 * its condition number exceeds 1e14 (standard errors would be meaningless).
 */
export function blockCovariance(problem: ProjectedProblem, s2: number): BlockCovariance | null {
  const p = problem.free.length;
  let sInv: Matrix = [];
  let conditionNumber = 1;
  if (p === 1) {
    // One nonlinear parameter: S is a positive number (scaled condition number 1).
    const s00 = problem.jtj[0];
    if (!(s00 > 0) || !Number.isFinite(s00)) return null;
    sInv = [[1 / s00]];
  } else if (p > 1) {
    const s: Matrix = [];
    for (let i = 0; i < p; i++) {
      const row: number[] = [];
      for (let j = 0; j < p; j++) row.push(problem.jtj[i * p + j]);
      s.push(row);
    }
    const inv = invertSymmetric(s, 1e14);
    if (inv === null) return null;
    sInv = inv.inverse;
    conditionNumber = inv.conditionNumber;
  }
  const linear: Matrix[] = [];
  const cross: Matrix[] = [];
  const sensitivity = new Float64Array(2);
  for (const block of problem.blocks) {
    const q = block.linearCount;
    if (q === 2) {
      // (1+|c|)/(1−|c|) is the condition number of the unit-diagonal Gram matrix of [g, 1].
      const c = Math.sqrt(Math.max(0, block.cosineSquared));
      const cond = (1 + c) / (1 - c);
      if (!(cond <= 1e14)) return null;
      conditionNumber = Math.max(conditionNumber, cond);
    }
    const gram: Matrix =
      q === 1
        ? [[block.gramInverse00]]
        : [
            [block.gramInverse00, block.gramInverse01],
            [block.gramInverse01, block.gramInverse11],
          ];
    // C = (ΦᵀΦ)⁻¹ΦᵀT (q × p).
    const cMat: Matrix = Array.from({ length: q }, () => new Array<number>(p).fill(0));
    for (let k = 0; k < p; k++) {
      block.linearSensitivity(problem.free[k], sensitivity);
      for (let r = 0; r < q; r++) cMat[r][k] = sensitivity[r];
    }
    // C S⁻¹ (q × p).
    const cs: Matrix = [];
    for (let r = 0; r < q; r++) {
      const row: number[] = [];
      for (let k = 0; k < p; k++) {
        let v = 0;
        for (let m = 0; m < p; m++) v += cMat[r][m] * sInv[m][k];
        row.push(v);
      }
      cs.push(row);
    }
    const lin: Matrix = Array.from({ length: q }, () => new Array<number>(q).fill(0));
    for (let r = 0; r < q; r++)
      for (let c = 0; c < q; c++) {
        let extra = 0;
        for (let k = 0; k < p; k++) extra += cs[r][k] * cMat[c][k];
        lin[r][c] = s2 * (gram[r][c] + extra);
      }
    linear.push(lin);
    for (const row of cs) for (let k = 0; k < p; k++) row[k] *= -s2;
    cross.push(cs);
  }
  for (const row of sInv) for (let k = 0; k < p; k++) row[k] *= s2;
  return { nonlinear: sInv, linear, cross, conditionNumber };
}
