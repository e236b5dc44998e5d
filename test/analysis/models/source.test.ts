import { describe, expect, it } from "vitest";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { sourceModel } from "../../../server/analysis/models/source.ts";
import { evaluateBasis, grid, jacobianDiscrepancy } from "./basisCheck.ts";

// Source: localized-source SDD steady states, METHODS.md §1 rows three and four,
// evaluated directly with cosh/sinh; the model's basis is (λ/s)·h with h = c/(ν/k).
function direct(x: number, lambdaUm: number, s: number, L: number): number {
  const a = Math.abs(x);
  const h = Number.isFinite(L)
    ? a < s
      ? 1 - (Math.sinh((L - s) / lambdaUm) * Math.cosh(a / lambdaUm)) / Math.sinh(L / lambdaUm)
      : (Math.sinh(s / lambdaUm) * Math.cosh((L - a) / lambdaUm)) / Math.sinh(L / lambdaUm)
    : a < s
      ? 1 - Math.exp(-s / lambdaUm) * Math.cosh(a / lambdaUm)
      : Math.sinh(s / lambdaUm) * Math.exp(-a / lambdaUm);
  return (lambdaUm / s) * h;
}

describe("sourceModel", () => {
  it("basis matches the closed forms of METHODS.md on semi-infinite and finite domains", () => {
    for (const L of [Infinity, 400]) {
      for (const [lambdaUm, s] of [[30, 50], [80, 10], [25, 200]]) {
        const x = grid(0, 400, 161);
        const { value } = evaluateBasis(sourceModel, x, [lambdaUm, s], L);
        x.forEach((xi, i) => {
          const d = direct(xi, lambdaUm, s, L);
          expect(Math.abs(value[i] - d)).toBeLessThan(1e-12 * Math.max(d, 1e-300));
        });
      }
    }
  });

  it("solves λ²g'' − g + λ/s·[x < s] = 0 with no flux at 0 (and at L)", () => {
    // Source: steady state of D c'' − k c + ν·[x < s] = 0 (METHODS.md §1); finite differences, common practice.
    const lambdaUm = 40;
    const s = 60;
    const h = 1e-3;
    for (const L of [Infinity, 300]) {
      for (const xi of [5, 30, 59, 61, 120, 250]) {
        const [gm, g0, gp] = evaluateBasis(sourceModel, [xi - h, xi, xi + h], [lambdaUm, s], L).value;
        const residual = (lambdaUm ** 2 * (gp - 2 * g0 + gm)) / (h * h) - g0 + (xi < s ? lambdaUm / s : 0);
        expect(Math.abs(residual)).toBeLessThan(1e-4);
      }
      const [g0, g1] = evaluateBasis(sourceModel, [0, h], [lambdaUm, s], L).value;
      expect(Math.abs((g1 - g0) / h)).toBeLessThan(1e-4);
    }
    const [ga, gb] = evaluateBasis(sourceModel, [300 - h, 300], [lambdaUm, s], 300).value;
    expect(Math.abs((gb - ga) / h)).toBeLessThan(1e-6);
  });

  it("is continuous with a continuous slope at the source edge x = s", () => {
    // Source: c and c' are continuous for a bounded production term (METHODS.md §1); common practice.
    const h = 1e-6;
    const s = 50;
    const [left, mid, right] = evaluateBasis(sourceModel, [s - h, s, s + h], [30, s]).value;
    expect(Math.abs(left - mid)).toBeLessThan(1e-7);
    expect(Math.abs(right - mid)).toBeLessThan(1e-7);
    const [a, b] = evaluateBasis(sourceModel, [s - 2e-3, s - 1e-3], [30, s]).value;
    const [c, d] = evaluateBasis(sourceModel, [s + 1e-3, s + 2e-3], [30, s]).value;
    expect(Math.abs((b - a) / 1e-3 - (d - c) / 1e-3)).toBeLessThan(1e-4);
  });

  it("falls as e^(−x/λ) outside the source", () => {
    // Source: x > s: c = (ν/k) sinh(s/λ) e^(−x/λ) (METHODS.md §1).
    const x = grid(60, 400, 69);
    const { value } = evaluateBasis(sourceModel, x, [35, 60]);
    const ratios = x.map((xi, i) => value[i] / Math.exp(-xi / 35));
    ratios.forEach((r) => expect(Math.abs(r / ratios[0] - 1)).toBeLessThan(1e-12));
  });

  it("tends to the exponential basis as s → 0", () => {
    // Source: s → 0 with νs = j0 gives the semi-infinite influx solution (METHODS.md §1);
    // the difference is ≈ s/(2λ) inside the source and ≈ s²/(6λ²) outside.
    const x = grid(0, 300, 61);
    const small = evaluateBasis(sourceModel, x, [40, 4e-7]).value;
    const exponential = evaluateBasis(exponentialModel, x, [40]).value;
    small.forEach((v, i) => expect(Math.abs(v - exponential[i])).toBeLessThan(1e-8 * exponential[0]));
  });

  it("stays finite for a source far wider than λ and a long domain", () => {
    // Source: overflow-free rewriting; sinh(800) = Infinity in double precision.
    expect(Math.sinh(800)).toBe(Infinity);
    const { value, derivatives } = evaluateBasis(sourceModel, grid(0, 1000, 201), [1, 800], 1000);
    for (const arr of [value, ...derivatives]) for (const v of arr) expect(Number.isFinite(v)).toBe(true);
    // Deep inside the source h → 1, so g = (λ/s)·h → 1/800.
    expect(value[0]).toBeCloseTo(1 / 800, 14);
  });

  it("analytic ∂g/∂λ and ∂g/∂s agree with central finite differences on both sides of s", () => {
    // common practice, no source
    const x = grid(0.3, 399.7, 97);
    expect(jacobianDiscrepancy(sourceModel, x, [40, 55])).toBeLessThan(1e-6);
    expect(jacobianDiscrepancy(sourceModel, x, [40, 55], 400)).toBeLessThan(1e-6);
    expect(jacobianDiscrepancy(sourceModel, x, [150, 20], 400)).toBeLessThan(1e-6);
    expect(jacobianDiscrepancy(sourceModel, x, [15, 210], 400)).toBeLessThan(1e-6);
  });

  it("reports ν/k = A·λ/s as the plateau inside a wide source", () => {
    // Source: x ≪ s ≫ λ: c → ν/k (METHODS.md §1); A = (ν/k)(s/λ) by the model's amplitude definition.
    const gradient = new Float64Array(4);
    const plateau = sourceModel.derived.find((d) => d.name === "plateauAu")!;
    expect(plateau.evaluate([20, 400], 20, 0, gradient)).toBeCloseTo(1, 14);
    // At x = 0 inside a source 20λ wide the profile is within e^(−20) of the plateau.
    const g = evaluateBasis(sourceModel, [0], [20, 400]).value[0];
    expect(Math.abs(20 * g - 1)).toBeLessThan(1e-8);
  });
});
