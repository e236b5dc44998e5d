import { describe, expect, it } from "vitest";
import { gaussHermite } from "../../../server/analysis/stats/gaussHermite.ts";
import { runPython } from "../../helpers/python.ts";

// Source: numpy.polynomial.hermite.hermgauss as reference.
const reference = await runPython<{ nodes: number[]; weights: number[] }[]>(
  `
from numpy.polynomial.hermite import hermgauss
result = [dict(zip(("nodes", "weights"), [a.tolist() for a in hermgauss(n)])) for n in data]
`,
  [1, 4, 12, 30],
);

describe("gaussHermite against numpy.polynomial.hermite.hermgauss", () => {
  it.each([0, 1, 2, 3].map((i) => [[1, 4, 12, 30][i], i]))("%i nodes: nodes and weights match to 1e-12", (n, i) => {
    const rule = gaussHermite(n);
    rule.nodes.forEach((t, k) => expect(Math.abs(t - reference[i].nodes[k])).toBeLessThan(1e-12 * Math.max(1, Math.abs(t))));
    rule.weights.forEach((w, k) => expect(Math.abs(w - reference[i].weights[k])).toBeLessThan(1e-12 * Math.max(1e-3, reference[i].weights[k]) + 1e-25));
  });
  it("gaussHermite(12) integrates E[Z⁴] = 3 for a standard normal exactly", () => {
    // Source: moments of the normal distribution (textbook).
    const rule = gaussHermite(12);
    let s = 0;
    rule.nodes.forEach((t, k) => (s += (rule.weights[k] / Math.sqrt(Math.PI)) * (Math.SQRT2 * t) ** 4));
    expect(s).toBeCloseTo(3, 12);
  });
});
