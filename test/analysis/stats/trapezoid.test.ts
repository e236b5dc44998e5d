import { describe, expect, it } from "vitest";
import { trapezoid, trapezoidWeights } from "../../../server/analysis/stats/trapezoid.ts";
import { runPython } from "../../helpers/python.ts";

describe("trapezoid against scipy.integrate.trapezoid", () => {
  it("trapezoid matches scipy on uneven positions to 1e-13", async () => {
    const x = [0, 0.3, 0.35, 1.2, 2, 2.05, 3.7];
    const y = x.map((v) => Math.sin(v) + v * v);
    // Source: scipy.integrate.trapezoid as reference.
    const ref = await runPython<number>(`from scipy import integrate\nresult = float(integrate.trapezoid(data["y"], data["x"]))`, { x, y });
    expect(trapezoid(y, x)).toBeCloseTo(ref, 13);
  });
  it("trapezoidWeights sum to the length of the interval and reject descending positions", () => {
    // Source: the rule integrates constants exactly (definition).
    expect(trapezoidWeights([1, 2, 4.5]).reduce((a, b) => a + b, 0)).toBe(3.5);
    expect(() => trapezoidWeights([0, 2, 1])).toThrow(/positions must ascend, got 2 then 1 at index 1/);
  });
});
