import type { Matrix } from "../linalg/matrix.ts";
import { blockCovariance, type BlockCovariance } from "./blockCovariance.ts";
import type { ProjectedProblem } from "./projectedProblem.ts";

/**
 * Heteroscedasticity-consistent ("sandwich") covariance of every fitted
 * parameter at the solution held by `problem`, HC3 variant:
 *   V = (JᵀJ)⁻¹ Jᵀ diag(r_i²/(1 − h_i)²) J (JᵀJ)⁻¹,  h_i = [J(JᵀJ)⁻¹Jᵀ]_ii,
 * with J the Jacobian of the (weighted) residuals over [θ free…, amplitude,
 * background?] of every block. It stays valid when the noise variance
 * changes from point to point (e.g. grows with the intensity) instead of
 * assuming one s² for all. Sources: White 1980, Econometrica (the sandwich);
 * MacKinnon & White 1985, J Econometrics (HC3: residuals inflated by
 * 1/(1 − h_i), which keeps small samples from under-covering).
 *
 * V = Σ_i u_i u_iᵀ with u_i = (JᵀJ)⁻¹J_iᵀ·r_i/(1 − h_i), the influence of
 * point i. The block structure of JᵀJ gives each influence without forming
 * it (partitioned regression, Frisch & Waugh 1933, Econometrica): with
 * φ_i the point's linear basis row, T_i its row of √w·A·∂g/∂θ, G_b = ΦᵀΦ and
 * C_b = G_b⁻¹ΦᵀT of its block, S the reduced Gram matrix the minimiser holds,
 *   t̃_i = T_i − φ_iᵀC_b,  d_i = S⁻¹t̃_i (its pull on θ),
 *   e_i = G_b⁻¹φ_i − C_b d_i (on its own block's linear parameters),
 *   −C_c d_i (on every other block c's),  h_i = φ_iᵀG_b⁻¹φ_i + t̃_iᵀd_i,
 * so the cost is linear in the number of points and blocks. Returns null
 * where the classic covariance does (singular S or basis) or when a point has
 * leverage 1.
 */
export function sandwichCovariance(problem: ProjectedProblem): BlockCovariance | null {
  const unit = blockCovariance(problem, 1);
  if (unit === null) return null;
  const p = problem.free.length;
  const sInv = unit.nonlinear;
  const sensitivity = new Float64Array(2);
  const tRow = new Float64Array(p);
  const tilde = new Float64Array(p);
  const d = new Float64Array(p);
  const phi = new Float64Array(2);
  const e = new Float64Array(2);
  const cd = new Float64Array(2);

  const thetaTheta: Matrix = zeros(p, p);
  const perBlock = problem.blocks.map((block) => {
    const q = block.linearCount;
    const c: Matrix = zeros(q, p);
    for (let k = 0; k < p; k++) {
      block.linearSensitivity(problem.free[k], sensitivity);
      for (let r = 0; r < q; r++) c[r][k] = sensitivity[r];
    }
    const gram: Matrix = q === 1 ? [[block.gramInverse00]] : [[block.gramInverse00, block.gramInverse01], [block.gramInverse01, block.gramInverse11]];
    return { c, gram, linear: zeros(q, q), cross: zeros(q, p) };
  });

  for (let b = 0; b < problem.blocks.length; b++) {
    const block = problem.blocks[b];
    const { c, gram, linear, cross } = perBlock[b];
    const q = block.linearCount;
    for (let i = 0; i < block.n; i++) {
      const sw = block.sqrtWeights[i];
      phi[0] = sw * block.basisValues[i];
      phi[1] = sw;
      for (let k = 0; k < p; k++) {
        tRow[k] = sw * block.amplitude * block.basisDerivatives[problem.free[k]][i];
        let v = tRow[k];
        for (let r = 0; r < q; r++) v -= phi[r] * c[r][k];
        tilde[k] = v;
      }
      let h = 0;
      for (let k = 0; k < p; k++) {
        let v = 0;
        for (let m = 0; m < p; m++) v += sInv[k][m] * tilde[m];
        d[k] = v;
        h += tilde[k] * v;
      }
      for (let r = 0; r < q; r++) {
        let g = 0;
        for (let s = 0; s < q; s++) g += gram[r][s] * phi[s];
        h += phi[r] * g;
        let cdr = 0;
        for (let k = 0; k < p; k++) cdr += c[r][k] * d[k];
        cd[r] = cdr;
        e[r] = g - cdr;
      }
      if (!(h < 1 - 1e-12)) return null;
      const rho = block.residual[i] / (1 - h);
      const rho2 = rho * rho;
      for (let k = 0; k < p; k++) for (let m = 0; m < p; m++) thetaTheta[k][m] += rho2 * d[k] * d[m];
      for (let r = 0; r < q; r++) {
        for (let s = 0; s < q; s++) linear[r][s] += rho2 * (e[r] * e[s] - cd[r] * cd[s]);
        for (let k = 0; k < p; k++) cross[r][k] += rho2 * (e[r] + cd[r]) * d[k];
      }
    }
  }
  // Add the pull of every point on each block's linear parameters through θ: −C·d_i.
  const linearOut: Matrix[] = [];
  const crossOut: Matrix[] = [];
  for (const { c, linear, cross } of perBlock) {
    const q = linear.length;
    const cv = mul(c, thetaTheta);
    for (let r = 0; r < q; r++) {
      for (let s = 0; s < q; s++) {
        let v = 0;
        for (let k = 0; k < p; k++) v += cv[r][k] * c[s][k];
        linear[r][s] += v;
      }
      for (let k = 0; k < p; k++) cross[r][k] -= cv[r][k];
    }
    linearOut.push(linear);
    crossOut.push(cross);
  }
  return { nonlinear: thetaTheta, linear: linearOut, cross: crossOut, conditionNumber: unit.conditionNumber };
}

function zeros(rows: number, cols: number): Matrix {
  return Array.from({ length: rows }, () => new Array<number>(cols).fill(0));
}

function mul(a: Matrix, b: Matrix): Matrix {
  const out = zeros(a.length, b[0]?.length ?? 0);
  for (let i = 0; i < a.length; i++)
    for (let k = 0; k < b.length; k++) {
      const v = a[i][k];
      for (let j = 0; j < out[i].length; j++) out[i][j] += v * b[k][j];
    }
  return out;
}
