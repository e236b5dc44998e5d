import { solveLinear } from "../linalg/solveLinear.ts";

/**
 * A start for the decay length from linear regression on running integrals
 * of the profile, needing no start itself (x ascending).
 *
 * Order 1, for A·e^(−x/λ) + B: integrating λy' = −(y − B) from x₀ gives
 *   y = a − (1/λ)·S(x) + (B/λ)·(x − x₀),  S(x) = ∫_{x₀}^{x} y dx,
 * linear in the unknowns, so least squares on [1, x − x₀, S] returns −1/λ.
 * Order 2, for any A·e^(−x/λ) + C·e^(x/λ) + B (the cosh shape of a finite
 * domain included): integrating λ²y'' = y − B twice gives
 *   y = a + b(x − x₀) − (B/2λ²)(x − x₀)² + (1/λ²)·SS(x),
 * with SS the double running integral; the coefficient of SS is 1/λ².
 * Derived here from the steady-state equation (METHODS.md §1); integrals by
 * the trapezoid rule, so noise is averaged rather than differentiated.
 * Returns null when the regression finds no decay (wrong sign) or fails.
 */
export function decayLengthFromIntegrals(x: ArrayLike<number>, y: ArrayLike<number>, order: 1 | 2): number | null {
  const n = x.length;
  if (n < (order === 1 ? 4 : 5)) return null;
  const x0 = x[0];
  const width = x[n - 1] - x0;
  if (!(width > 0)) return null;
  // Regressors scaled by the window width so the normal equations are well balanced.
  const inv = 1 / width;
  const inv2 = inv * inv;
  let s = 0;
  let ss = 0;
  // Upper triangle of the Gram matrix of [1, u, v, z] and its right-hand side.
  let g01 = 0, g02 = 0, g03 = 0, g11 = 0, g12 = 0, g13 = 0, g22 = 0, g23 = 0, g33 = 0;
  let r0 = 0, r1 = 0, r2 = 0, r3 = 0;
  for (let i = 0; i < n; i++) {
    if (i > 0) {
      const h = 0.5 * (x[i] - x[i - 1]);
      const sPrev = s;
      s += h * (y[i] + y[i - 1]);
      ss += h * (s + sPrev);
    }
    const yi = y[i];
    const u = (x[i] - x0) * inv;
    // Order 1 regresses on S, order 2 on (x − x₀)² and SS.
    const v = order === 1 ? s * inv : u * u;
    g01 += u;
    g02 += v;
    g11 += u * u;
    g12 += u * v;
    g22 += v * v;
    r0 += yi;
    r1 += u * yi;
    r2 += v * yi;
    if (order === 2) {
      const z = ss * inv2;
      g03 += z;
      g13 += u * z;
      g23 += v * z;
      g33 += z * z;
      r3 += z * yi;
    }
  }
  const gram =
    order === 1
      ? [
          [n, g01, g02],
          [g01, g11, g12],
          [g02, g12, g22],
        ]
      : [
          [n, g01, g02, g03],
          [g01, g11, g12, g13],
          [g02, g12, g22, g23],
          [g03, g13, g23, g33],
        ];
  const c = solveLinear(gram, order === 1 ? [r0, r1, r2] : [r0, r1, r2, r3]);
  if (c === null) return null;
  // Undo the scaling: the regressors were S/width and SS/width².
  const lambdaUm = order === 1 ? -width / c[2] : width / Math.sqrt(c[3]);
  return Number.isFinite(lambdaUm) && lambdaUm > 0 ? lambdaUm : null;
}
