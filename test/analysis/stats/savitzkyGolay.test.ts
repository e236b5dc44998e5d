import { describe, expect, it } from "vitest";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { savitzkyGolay, savitzkyGolayWeights } from "../../../server/analysis/stats/savitzkyGolay.ts";
import { runPython } from "../../helpers/python.ts";

const random = createRandom(11);
const y = Array.from({ length: 61 }, (_, k) => Math.exp(-k / 15) + 0.05 * random.normal());
const cases: [number, number, number, number][] = [
  // window, order, derivative, spacing
  [5, 2, 0, 1],
  [11, 3, 0, 1],
  [11, 3, 1, 2.5],
  [21, 4, 1, 0.5],
  [7, 2, 2, 1],
  [61, 5, 1, 1],
];

// Source: scipy.signal.savgol_filter (mode="interp", the default) and savgol_coeffs as reference.
const reference = await runPython<{ filtered: number[][]; coeffs: number[] }>(
  `
from scipy.signal import savgol_filter, savgol_coeffs
y = np.array(data["y"])
result = {
  "filtered": [savgol_filter(y, w, p, deriv=d, delta=dx).tolist() for (w, p, d, dx) in data["cases"]],
  "coeffs": savgol_coeffs(9, 3, deriv=1, delta=0.7, use="dot").tolist(),
}
`,
  { y, cases },
);

describe("savitzkyGolay against scipy.signal.savgol_filter", () => {
  it.each(cases.map((c, i) => [i, ...c]))(
    "case %i (window %i, order %i, derivative %i, spacing %f) matches to 1e-10 of the signal scale, edges included",
    (i, windowPoints, polynomialOrder, derivative, spacing) => {
      const out = savitzkyGolay(y, { windowPoints, polynomialOrder, derivative, spacing });
      const ref = reference.filtered[i];
      const scale = Math.max(...ref.map(Math.abs));
      out.forEach((v, k) => expect(Math.abs(v - ref[k])).toBeLessThan(1e-10 * scale));
    },
  );
  it("savitzkyGolayWeights for the window centre equal scipy.signal.savgol_coeffs(use='dot')", () => {
    const w = savitzkyGolayWeights(9, 3, 1, 0.7, 4);
    w.forEach((v, j) => expect(v).toBeCloseTo(reference.coeffs[j], 12));
  });
  it("savitzkyGolay reproduces a polynomial of the filter's order exactly (value and slope)", () => {
    // Source: defining property of least-squares polynomial smoothing (Savitzky & Golay 1964).
    const xs = Array.from({ length: 40 }, (_, k) => 0.3 * k);
    const cubic = xs.map((x) => 2 - x + 0.5 * x * x - 0.05 * x ** 3);
    const slope = savitzkyGolay(cubic, { windowPoints: 9, polynomialOrder: 3, derivative: 1, spacing: 0.3 });
    xs.forEach((x, k) => expect(slope[k]).toBeCloseTo(-1 + x - 0.15 * x * x, 9));
  });
  it("savitzkyGolay rejects an even window with a message naming it", () => {
    expect(() => savitzkyGolay(y, { windowPoints: 10, polynomialOrder: 2 })).toThrow(/windowPoints must be a positive odd integer, got 10/);
  });
});
