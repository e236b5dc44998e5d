import { describe, expect, it } from "vitest";
import { decayLengthFromIntegrals } from "../../../server/analysis/models/decayLengthFromIntegrals.ts";

describe("decayLengthFromIntegrals", () => {
  const x = Array.from({ length: 201 }, (_, i) => 2 * i);

  it("order 1 recovers λ of A·e^(−x/λ) + B to the trapezoid rule's O((h/λ)²) error", () => {
    // Source: λy' = −(y − B) integrated from x₀ (derived from METHODS.md §1); trapezoid error h²/12 per unit.
    const y = x.map((v) => 120 * Math.exp(-v / 45) + 30);
    const lambdaUm = decayLengthFromIntegrals(x, y, 1)!;
    expect(Math.abs(lambdaUm / 45 - 1)).toBeLessThan(2 * (2 / 45) ** 2);
  });

  it("order 2 recovers λ of a cosh-shaped finite-domain profile", () => {
    // Source: λ²y'' = y − B (METHODS.md §1, finite domain).
    const L = 400;
    const y = x.map((v) => (80 * Math.cosh((L - v) / 150)) / Math.cosh(L / 150) + 10);
    const lambdaUm = decayLengthFromIntegrals(x, y, 2)!;
    expect(Math.abs(lambdaUm / 150 - 1)).toBeLessThan(1e-3);
  });

  it("returns null for a rising profile and for too few points", () => {
    // common practice, no source
    expect(decayLengthFromIntegrals(x, x.map((v) => 1 + v), 1)).toBeNull();
    expect(decayLengthFromIntegrals([0, 1, 2], [3, 2, 1], 1)).toBeNull();
  });
});
