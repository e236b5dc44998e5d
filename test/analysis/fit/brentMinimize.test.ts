import { describe, expect, it } from "vitest";
import { brentMinimize } from "../../../server/analysis/fit/brentMinimize.ts";

describe("brentMinimize", () => {
  it("finds the minimum of cos on [3, 4] at π and of a shifted parabola at its vertex", () => {
    // Source: calculus (cos has its minimum at π; (x − 2)² + 1 at x = 2).
    const cos = brentMinimize(Math.cos, 3, 4, 1e-12, 1e-14);
    expect(cos.x).toBeCloseTo(Math.PI, 7);
    expect(cos.fx).toBeCloseTo(-1, 14);
    const parabola = brentMinimize((x) => (x - 2) ** 2 + 1, -10, 10, 1e-12, 1e-14);
    expect(parabola.x).toBeCloseTo(2, 7);
    // Fewer evaluations than golden-section search alone needs to shrink [−10, 10] to the
    // final bracket of 4·tol ≈ 8e-12: log(20/8e-12)/log(1.618) ≈ 59 (Brent 1973, ch. 5).
    expect(parabola.evaluations).toBeLessThan(59);
  });

  it("returns the bracket end for a monotone function and refuses an empty bracket", () => {
    // common practice, no source
    expect(brentMinimize((x) => x, 1, 2, 1e-10, 1e-12).x).toBeCloseTo(1, 8);
    expect(() => brentMinimize((x) => x, 2, 1)).toThrow(RangeError);
  });
});
