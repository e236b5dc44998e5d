import { describe, expect, it } from "vitest";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { evaluateBasis, grid, jacobianDiscrepancy } from "./basisCheck.ts";

describe("exponentialModel", () => {
  it("basis is e^(−x/λ), the semi-infinite SDD steady state", () => {
    // Source: textbook SDD steady state c ∝ e^(−x/λ) (METHODS.md §1, first row).
    const x = grid(0, 400, 201);
    const { value } = evaluateBasis(exponentialModel, x, [37.5]);
    x.forEach((xi, i) => expect(Math.abs(value[i] - Math.exp(-xi / 37.5))).toBeLessThanOrEqual(1e-14 * Math.exp(-xi / 37.5) + 1e-300));
  });

  it("basis solves λ²g'' = g (the steady-state equation) by finite differences", () => {
    // Source: D c'' − k c = 0 with λ² = D/k (METHODS.md §1); second difference, common practice.
    const lambdaUm = 20;
    const h = 1e-3;
    for (const xi of [0.5, 10, 35, 80]) {
      const [gm, g0, gp] = evaluateBasis(exponentialModel, [xi - h, xi, xi + h], [lambdaUm]).value;
      expect(Math.abs((lambdaUm ** 2 * (gp - 2 * g0 + gm)) / (h * h) - g0)).toBeLessThan(1e-5 * g0);
    }
  });

  it("analytic ∂g/∂λ agrees with central finite differences", () => {
    // common practice, no source
    expect(jacobianDiscrepancy(exponentialModel, grid(0, 300, 61), [42])).toBeLessThan(1e-7);
    expect(jacobianDiscrepancy(exponentialModel, grid(-20, 50, 31), [3])).toBeLessThan(1e-7);
  });

  it("initialGuess lands within 1% of λ on a noise-free profile with background", () => {
    // common practice, no source
    const x = Float64Array.from(grid(0, 300, 151));
    const y = x.map((v) => 80 * Math.exp(-v / 45) + 12);
    const [guess] = exponentialModel.initialGuess(x, y, { xMinUm: 0, xMaxUm: 300, minSpacingUm: 2, lengthUm: null });
    expect(Math.abs(guess / 45 - 1)).toBeLessThan(0.01);
  });

  it("declares D/k = λ² as a derived quantity with gradient 2λ", () => {
    // Source: λ = √(D/k) (METHODS.md §1).
    const gradient = new Float64Array(3);
    const [ratio] = exponentialModel.derived;
    expect(ratio.evaluate([12], 5, 1, gradient)).toBe(144);
    expect(Array.from(gradient)).toEqual([24, 0, 0]);
  });
});
