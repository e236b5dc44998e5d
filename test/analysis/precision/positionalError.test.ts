import { describe, expect, it } from "vitest";
import { analysePrecision } from "../../../server/analysis/precision/analysePrecision.ts";
import { ensembleMoments } from "../../../server/analysis/precision/ensembleMoments.ts";
import { meanSlope } from "../../../server/analysis/precision/meanSlope.ts";
import { positionalErrorCurve } from "../../../server/analysis/precision/positionalError.ts";
import { runPython } from "../../helpers/python.ts";
import { exponentialGroup } from "./simulateGradients.ts";

const lambdaUm = 80;
const cv = 0.1;
// Source: METHODS.md §4 [derived] — exponential mean with log-normal multiplicative noise of constant
// CV has σ_x = λ·CV exactly; σ_x = σ_c/|dc̄/dx| from Gregor, Tank, Wieschaus, Bialek 2007, Cell.
const expectedSigmaUm = lambdaUm * cv;
const middle = (x: number) => x >= 100 && x <= 300;

describe("positional error σ_x = σ_c/|dc̄/dx|", () => {
  it("analysePrecision gives σ_x within 10% of λ·CV over the middle for 200 embryos (amplitude noise), and the bootstrap band covers λ·CV", () => {
    const group = exponentialGroup({ embryos: 200, lambdaUm, cv, noise: "amplitude", seed: 1 });
    const r = analysePrecision(group, { bootstrap: { resamples: 300, seed: 2 }, decoding: { enabled: false }, information: { extrapolate: false } });
    let checked = 0;
    r.gridX.forEach((x, k) => {
      if (!middle(x)) return;
      checked += 1;
      expect(r.sigmaX[k]).not.toBeNull();
      expect(Math.abs((r.sigmaX[k] as number) / expectedSigmaUm - 1)).toBeLessThan(0.1);
      const band = r.sigmaXCi95[k] as [number, number];
      expect(band[0]).toBeLessThanOrEqual(expectedSigmaUm);
      expect(band[1]).toBeGreaterThanOrEqual(expectedSigmaUm);
    });
    expect(checked).toBe(101);
  });

  it("analysePrecision with independent noise at every position: mean σ_x over the middle within 3% of λ·CV, ≥ 85% of the pointwise 95% bands cover it", () => {
    const group = exponentialGroup({ embryos: 200, lambdaUm, cv, noise: "pointwise", seed: 3 });
    const r = analysePrecision(group, { bootstrap: { resamples: 300, seed: 4 }, decoding: { enabled: false }, information: { extrapolate: false } });
    const inMiddle = r.gridX.map((x, k) => [x, k]).filter(([x]) => middle(x)).map(([, k]) => k);
    const mean = inMiddle.reduce((s, k) => s + (r.sigmaX[k] as number), 0) / inMiddle.length;
    expect(Math.abs(mean / expectedSigmaUm - 1)).toBeLessThan(0.03);
    const covered = inMiddle.filter((k) => {
      const [lo, hi] = r.sigmaXCi95[k] as [number, number];
      return lo <= expectedSigmaUm && expectedSigmaUm <= hi;
    }).length;
    expect(covered / inMiddle.length).toBeGreaterThanOrEqual(0.85);
  });

  it("the bootstrap relative error of σ_x is close to 1/√(2(n−1)) for 50 embryos", () => {
    // Source: Gregor et al. 2007, Cell / METHODS.md §4: relative error of σ_x ≈ 1/√(2(n−1)) (normal-theory SD of an SD).
    const group = exponentialGroup({ embryos: 50, lambdaUm, cv, noise: "amplitude", seed: 5 });
    const r = analysePrecision(group, { bootstrap: { resamples: 400, seed: 6 }, decoding: { enabled: false }, information: { extrapolate: false } });
    const k = r.gridX.indexOf(200);
    const [lo, hi] = r.sigmaXCi95[k] as [number, number];
    const relativeHalfWidth = (hi - lo) / (2 * 1.96 * (r.sigmaX[k] as number));
    expect(r.sigmaXExpectedRelativeError).toBeCloseTo(1 / Math.sqrt(98), 12);
    expect(relativeHalfWidth / r.sigmaXExpectedRelativeError).toBeGreaterThan(0.7);
    expect(relativeHalfWidth / r.sigmaXExpectedRelativeError).toBeLessThan(1.3);
  });

  it("σ_x matches a numpy reference using np.gradient for the slope of the mean (within 0.5% over the middle)", async () => {
    const group = exponentialGroup({ embryos: 60, lambdaUm, cv, noise: "amplitude", seed: 7 });
    const x = Array.from(group[0].positionUm);
    const values = group.map((p) => Float64Array.from(p.intensity));
    const moments = ensembleMoments(values);
    const slope = meanSlope(Float64Array.from(x), 2, values, { method: "savitzky-golay", windowPoints: null, polynomialOrder: 3 });
    const curve = positionalErrorCurve(x, moments.sd, slope.slope, slope.slopeSe, { minSlopeSnr: 3, maxSigmaFraction: 0.25 });
    // Source: numpy (mean, std with ddof=1, np.gradient) as reference on the same arrays.
    const ref = await runPython<number[]>(
      `
c = np.array(data["c"])
x = np.array(data["x"])
result = (c.std(axis=0, ddof=1) / np.abs(np.gradient(c.mean(axis=0), x))).tolist()
`,
      { c: values.map((v) => Array.from(v)), x },
    );
    x.forEach((xi, k) => {
      if (middle(xi)) expect(Math.abs(curve.sigmaX[k] / ref[k] - 1)).toBeLessThan(0.005);
    });
  });

  it("a model slope supplied by the caller is used as given: σ_x = σ_c/|model slope| exactly (numpy reference)", async () => {
    const group = exponentialGroup({ embryos: 40, lambdaUm, cv, noise: "pointwise", seed: 8 });
    const model = (xs: number[]) => ({
      value: xs.map((x) => 1000 * Math.exp(-x / lambdaUm)),
      slope: xs.map((x) => (-1000 / lambdaUm) * Math.exp(-x / lambdaUm)),
    });
    const r = analysePrecision(group, {
      derivative: { method: "model", slopeModel: model },
      mask: { minSlopeSnr: 0, maxSigmaFraction: 10 },
      bootstrap: { resamples: 0 },
      decoding: { enabled: false },
      information: { extrapolate: false },
    });
    // Source: numpy std (ddof=1) over embryos divided by the analytic slope, as reference.
    const ref = await runPython<number[]>(
      `
c = np.array(data["c"]); x = np.array(data["x"])
result = (c.std(axis=0, ddof=1) / (1000 / 80 * np.exp(-x / 80))).tolist()
`,
      { c: group.map((p) => Array.from(p.intensity)), x: Array.from(group[0].positionUm) },
    );
    r.sigmaX.forEach((s, k) => expect(Math.abs((s as number) / ref[k] - 1)).toBeLessThan(1e-12));
    expect(r.settings.derivative.method).toBe("model");
    expect(r.settings.derivative.modelDeviationRms).not.toBeNull();
  });

  it("positionalErrorCurve masks a flat stretch as 'shallow-slope' and a position without spread as 'no-variance'", () => {
    // common practice, no source: σ_x is meaningless where the data cannot resolve a slope or have no spread.
    const x = Array.from({ length: 41 }, (_, k) => k);
    const sd = x.map((v) => (v === 0 ? 0 : 0.1));
    const slope = x.map((v) => (v < 20 ? -1 : 0.001));
    const se = x.map(() => 0.01);
    const curve = positionalErrorCurve(x, sd, slope, se, { minSlopeSnr: 3, maxSigmaFraction: 0.25 });
    expect(curve.mask[0]).toBe("no-variance");
    expect(curve.mask[10]).toBeNull();
    expect(curve.sigmaX[10]).toBeCloseTo(0.1, 12);
    expect(curve.mask[30]).toBe("shallow-slope");
    expect(Number.isNaN(curve.sigmaX[30])).toBe(true);
  });

  it("positionalErrorCurve masks σ_x larger than maxSigmaFraction of the span as 'imprecise'", () => {
    // common practice, no source.
    const x = [0, 1, 2, 3, 4];
    const curve = positionalErrorCurve(x, [1, 1, 1, 1, 1], [-10, -10, -0.5, -10, -10], [0, 0, 0, 0, 0], { minSlopeSnr: 3, maxSigmaFraction: 0.25 });
    expect(curve.mask).toEqual([null, null, "imprecise", null, null]);
  });
});
