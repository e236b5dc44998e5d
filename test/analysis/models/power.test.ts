import { describe, expect, it } from "vitest";
import { powerModel } from "../../../server/analysis/models/power.ts";
import { evaluateBasis, grid, jacobianDiscrepancy } from "./basisCheck.ts";

describe("powerModel", () => {
  it("A·(1 + x/x0)^(−2) solves D c'' = k c² with A = 6D/(k x0²)", () => {
    // Source: Eldar, Rosin, Shilo, Barkai 2003, Dev Cell: c = 6D/(k(x + ε)²); second difference, common practice.
    const x0 = 25;
    const amplitude = 7;
    const kOverD = 6 / (amplitude * x0 * x0);
    const h = 1e-3;
    for (const xi of [0.5, 10, 60, 200]) {
      const [gm, g0, gp] = evaluateBasis(powerModel, [xi - h, xi, xi + h], [x0]).value.map((g) => amplitude * g);
      expect(Math.abs((gp - 2 * g0 + gm) / (h * h) / (g0 * g0) - kOverD)).toBeLessThan(1e-5 * kOverD);
    }
  });

  it("derived D/k = A·x0²/6 matches the same relation", () => {
    // Source: Eldar et al. 2003 (A = 6D/(k x0²)).
    const gradient = new Float64Array(3);
    const [ratio] = powerModel.derived;
    expect(ratio.evaluate([25], 7, 0, gradient)).toBeCloseTo((7 * 625) / 6, 12);
    expect(gradient[0]).toBeCloseTo((7 * 25) / 3, 12);
    expect(gradient[1]).toBeCloseTo(625 / 6, 12);
  });

  it("falls to a quarter of its amplitude at x = x0", () => {
    // Source: (1 + 1)^(−2) = 1/4, arithmetic.
    expect(evaluateBasis(powerModel, [33], [33]).value[0]).toBe(0.25);
  });

  it("analytic ∂g/∂x0 agrees with central finite differences", () => {
    // common practice, no source
    expect(jacobianDiscrepancy(powerModel, grid(0, 500, 101), [30])).toBeLessThan(1e-7);
    expect(jacobianDiscrepancy(powerModel, grid(-5, 50, 56), [8])).toBeLessThan(1e-7);
  });
});
