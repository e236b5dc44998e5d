import { describe, expect, it } from "vitest";
import { analysePrecision } from "../../../server/analysis/precision/analysePrecision.ts";
import { boundaryCrossings, firstCrossing, standardDeviationEstimate } from "../../../server/analysis/precision/boundaryVariability.ts";
import { runPython } from "../../helpers/python.ts";
import { exponentialGroup } from "./simulateGradients.ts";

describe("boundary variability", () => {
  it("firstCrossing interpolates linearly, takes the first crossing from the source end and returns null without one", () => {
    // Source: linear interpolation between grid points (definition).
    const x = [0, 1, 2, 3, 4, 5];
    expect(firstCrossing(x, [5, 4, 3, 2, 1, 0], 2.5)).toBeCloseTo(2.5, 14);
    expect(firstCrossing(x, [5, 4, 3, 2, 1, 0], 2)).toBe(3);
    expect(firstCrossing(x, [5, 1, 3, 1, 0, 0], 2)).toBeCloseTo(0.75, 14);
    expect(firstCrossing(x, [5, 4, 3, 3, 3, 3], 2)).toBeNull();
  });

  it("standardDeviationEstimate gives the chi-square interval s·√((n−1)/χ²) as computed with scipy.stats.chi2", async () => {
    const v = [101.2, 98.7, 103.5, 99.9, 97.1, 100.4, 102.8, 96.5, 100.0, 104.1];
    // Source: scipy.stats.chi2.ppf and numpy std (ddof=1) as reference for the normal-theory interval of an SD.
    const ref = await runPython<number[]>(
      `
from scipy import stats
v = np.array(data); n = len(v); s = v.std(ddof=1)
result = [float(s), float(s * np.sqrt((n - 1) / stats.chi2.ppf(0.975, n - 1))), float(s * np.sqrt((n - 1) / stats.chi2.ppf(0.025, n - 1)))]
`,
      v,
    );
    const e = standardDeviationEstimate(v)!;
    expect(e.value).toBeCloseTo(ref[0], 12);
    expect(e.ci95![0]).toBeCloseTo(ref[1], 10);
    expect(e.ci95![1]).toBeCloseTo(ref[2], 10);
  });

  it("boundary SD equals σ_x at the threshold within sampling error (200 embryos, amplitude and decay-length noise)", () => {
    // Source: Gregor et al. 2007, Cell; METHODS.md §4 — for small noise the SD of the crossing positions equals
    // σ_x at that position. Sampling error of each: ~1/√(2(n−1)) = 5%.
    const group = exponentialGroup({ embryos: 200, lambdaUm: 80, cv: 0.1, lambdaCv: 0.04, noise: "amplitude", seed: 41 });
    const r = analysePrecision(group, { boundary: { atPosition: 200 }, bootstrap: { resamples: 200, seed: 42 }, decoding: { enabled: false }, information: { extrapolate: false } });
    const b = r.boundary!;
    expect(b.thresholdSource).toBe("mean level at position");
    expect(b.neverCross).toEqual([]);
    expect(Math.abs(b.meanProfileCrossing! - 200)).toBeLessThan(0.5);
    expect(Math.abs(b.ratio! - 1)).toBeLessThan(0.1);
    const [lo, hi] = b.sd!.ci95!;
    expect(lo).toBeLessThanOrEqual(b.sigmaXAtThreshold!.value);
    expect(hi).toBeGreaterThanOrEqual(b.sigmaXAtThreshold!.value);
    expect(b.sdBootstrapCi95).not.toBeNull();
  });

  it("boundaryCrossings lists embryos that never reach the threshold and leaves them out of the SD", () => {
    // common practice, no source.
    const x = [0, 1, 2, 3];
    const r = boundaryCrossings(x, ["a", "b", "c", "d"], [[4, 3, 2, 1], [4, 3.5, 3, 2.5], [5, 3, 1, 0], [1.5, 1, 0.5, 0]], 2.2);
    expect(r.neverCross).toEqual(["b", "d"]);
    expect(r.positions.map((p) => p.position)).toEqual([1.8, null, 1.4, null].map((v) => (v === null ? null : expect.closeTo(v, 12))));
    expect(r.sd!.value).toBeCloseTo(Math.sqrt(0.08), 12);
  });
});
