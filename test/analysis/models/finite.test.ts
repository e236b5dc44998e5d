import { describe, expect, it } from "vitest";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { finiteModel } from "../../../server/analysis/models/finite.ts";
import { evaluateBasis, grid, jacobianDiscrepancy } from "./basisCheck.ts";

describe("finiteModel", () => {
  it("basis equals cosh((L−x)/λ)/cosh(L/λ) evaluated directly where cosh does not overflow", () => {
    // Source: SDD steady state with no flux at L (METHODS.md §1, second row), renormalised to g(0) = 1.
    const L = 500;
    for (const lambdaUm of [30, 150, 900]) {
      const x = grid(0, L, 101);
      const { value } = evaluateBasis(finiteModel, x, [lambdaUm], L);
      x.forEach((xi, i) => {
        const direct = Math.cosh((L - xi) / lambdaUm) / Math.cosh(L / lambdaUm);
        expect(Math.abs(value[i] - direct)).toBeLessThan(1e-14 * direct + 1e-300);
      });
    }
  });

  it("has zero slope at the far end (no flux at x = L) and g(0) = 1", () => {
    // Source: no-flux boundary c'(L) = 0 (METHODS.md §1); central difference, common practice.
    const L = 300;
    const h = 1e-4;
    const [gm, gp] = evaluateBasis(finiteModel, [L - 2 * h, L], [80], L).value;
    const slopeNearL = (gp - gm) / (2 * h);
    expect(Math.abs(slopeNearL)).toBeLessThan(1e-6);
    expect(evaluateBasis(finiteModel, [0], [80], L).value[0]).toBeCloseTo(1, 14);
  });

  it("equals the exponential basis within 1e-6 once L/λ > 15", () => {
    // Source: cosh((L−x)/λ)/cosh(L/λ) − e^(−x/λ) ≤ e^(−L/λ) on [0, L] (METHODS.md §1, derived).
    const L = 480;
    const lambdaUm = L / 15.5;
    const x = grid(0, L, 241);
    const finite = evaluateBasis(finiteModel, x, [lambdaUm], L).value;
    const exponential = evaluateBasis(exponentialModel, x, [lambdaUm]).value;
    finite.forEach((v, i) => expect(Math.abs(v - exponential[i])).toBeLessThan(1e-6));
  });

  it("stays finite at L/λ = 1000, where cosh overflows", () => {
    // Source: the overflow-free form of METHODS.md §1 ("Overflow"); cosh(1000) = Infinity in double precision.
    const L = 1000;
    expect(Math.cosh(L / 1)).toBe(Infinity);
    const x = grid(0, L, 1001);
    const { value, derivatives } = evaluateBasis(finiteModel, x, [1], L);
    for (let i = 0; i < x.length; i++) {
      expect(Number.isFinite(value[i])).toBe(true);
      expect(Number.isFinite(derivatives[0][i])).toBe(true);
    }
    expect(value[10]).toBeCloseTo(Math.exp(-10), 15);
  });

  it("analytic ∂g/∂λ agrees with central finite differences for short and long decay", () => {
    // common practice, no source
    expect(jacobianDiscrepancy(finiteModel, grid(0, 400, 81), [60], 400)).toBeLessThan(1e-7);
    expect(jacobianDiscrepancy(finiteModel, grid(0, 400, 81), [900], 400)).toBeLessThan(1e-7);
    expect(jacobianDiscrepancy(finiteModel, grid(0, 400, 81), [4], 400)).toBeLessThan(1e-7);
  });

  it("checkDomain asks for L, and rejects positions beyond L", () => {
    // common practice, no source
    expect(finiteModel.checkDomain({ xMinUm: 0, xMaxUm: 100, minSpacingUm: 1, lengthUm: null })).toMatch(/embryo length L/);
    expect(finiteModel.checkDomain({ xMinUm: 0, xMaxUm: 120, minSpacingUm: 1, lengthUm: 100 })).toMatch(/beyond the embryo length L = 100 µm/);
    expect(finiteModel.checkDomain({ xMinUm: 0, xMaxUm: 100, minSpacingUm: 1, lengthUm: 100 })).toBeNull();
  });
});
