import { describe, expect, it } from "vitest";
import { defaultRobustScale, robustWeight } from "../../../server/analysis/fit/robustWeight.ts";

describe("robustWeight", () => {
  it("equals ρ'(z) of scipy's soft_l1 and huber losses, by central differences of ρ", () => {
    // Source: loss definitions in the scipy.optimize.least_squares documentation:
    // soft_l1 ρ(z) = 2((1 + z)^½ − 1); huber ρ(z) = z for z ≤ 1, 2z^½ − 1 otherwise; z = (r/scale)².
    const rho = {
      "soft-l1": (z: number) => 2 * (Math.sqrt(1 + z) - 1),
      huber: (z: number) => (z <= 1 ? z : 2 * Math.sqrt(z) - 1),
    };
    for (const loss of ["soft-l1", "huber"] as const) {
      for (const r of [-7, -1.3, 0.4, 2.2, 15]) {
        const z = (r / 1.7) ** 2;
        const h = 1e-6 * Math.max(z, 1e-3);
        const derivative = (rho[loss](z + h) - rho[loss](z - h)) / (2 * h);
        expect(robustWeight(loss, r, 1.7)).toBeCloseTo(derivative, 6);
      }
    }
    expect(robustWeight("none", 1e6, 1)).toBe(1);
  });

  it("default scale is 1.345 × the scaled MAD (1.4826·MAD)", () => {
    // Source: Huber 1981, Robust Statistics (tuning constant 1.345); MAD scaling 1.4826 for normal data.
    // By hand: residuals −3, −1, 0, 1, 2, 10 → median 0.5, |deviations| 3.5, 1.5, 0.5, 0.5, 1.5, 9.5 → MAD 1.5.
    expect(defaultRobustScale([-3, -1, 0, 1, 2, 10])).toBeCloseTo(1.345 * 1.482602218505602 * 1.5, 12);
  });
});
