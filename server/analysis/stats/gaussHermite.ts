import { symmetricEigen } from "../linalg/symmetricEigen.ts";

export interface QuadratureRule {
  nodes: Float64Array;
  weights: Float64Array;
}

const cache = new Map<number, QuadratureRule>();

/**
 * Gauss–Hermite rule for ∫ f(t) e^{−t²} dt ≈ Σ w_k f(t_k) (physicists' weight),
 * exact for polynomials of degree < 2n. Nodes are the eigenvalues of the
 * symmetric Jacobi matrix with off-diagonal √(k/2); weights are √π times the
 * squared first components of its eigenvectors.
 * Source: Golub & Welsch 1969, Math Comp 23:221.
 * For E[f(Z)] with Z ~ N(μ, σ²) use Σ (w_k/√π) f(μ + √2 σ t_k).
 */
export function gaussHermite(n: number): QuadratureRule {
  if (!Number.isInteger(n) || n < 1 || n > 100) throw new RangeError(`gaussHermite: n must be an integer in [1, 100], got ${n}`);
  const hit = cache.get(n);
  if (hit) return hit;
  const jacobi = Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => (Math.abs(i - j) === 1 ? Math.sqrt(Math.max(i, j) / 2) : 0)),
  );
  const { values, vectors } = symmetricEigen(jacobi);
  const rule: QuadratureRule = {
    nodes: Float64Array.from(values),
    weights: Float64Array.from(values, (_, k) => Math.sqrt(Math.PI) * vectors[0][k] ** 2),
  };
  cache.set(n, rule);
  return rule;
}
