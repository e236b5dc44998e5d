import { describe, expect, it } from "vitest";
import type { Profile } from "../../../server/analysis/ensemble/profile.ts";
import { analyseJointPrecision } from "../../../server/analysis/precision/analyseJointPrecision.ts";
import { gaussianInformation, jointGaussianInformation } from "../../../server/analysis/precision/gaussianInformation.ts";
import { independentSigmaX, inverseCovarianceBias, jointSigmaX } from "../../../server/analysis/precision/jointPositionalError.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython } from "../../helpers/python.ts";
import { nonFinitePaths } from "./simulateGradients.ts";

const x = Array.from({ length: 201 }, (_, k) => 2 * k);
const anterior = (v: number) => 1000 * Math.exp(-v / 80);
const posterior = (v: number) => 600 * Math.exp(-(400 - v) / 120);

/**
 * Two channels in the same embryos with multiplicative noise (CV 0.1 and 0.15). With `orthogonal`,
 * at every position the second channel's noise is made exactly uncorrelated with the first across
 * the embryos (Gram–Schmidt), so the sample covariance is diagonal.
 */
function twoChannels(n: number, seed: number, orthogonal: boolean): { a: Profile[]; b: Profile[] } {
  const random = createRandom(seed);
  const e1 = x.map(() => Array.from({ length: n }, () => random.normal()));
  const e2 = x.map(() => Array.from({ length: n }, () => random.normal()));
  if (orthogonal)
    for (let k = 0; k < x.length; k++) {
      const centre = (v: number[]) => {
        const m = v.reduce((s, u) => s + u, 0) / n;
        return v.map((u) => u - m);
      };
      const u = centre(e1[k]);
      const w = centre(e2[k]);
      const proj = w.reduce((s, v, i) => s + v * u[i], 0) / u.reduce((s, v) => s + v * v, 0);
      e1[k] = u;
      e2[k] = w.map((v, i) => v - proj * u[i]);
    }
  const make = (f: (v: number) => number, cv: number, e: number[][]): Profile[] =>
    Array.from({ length: n }, (_, i) => ({ embryo: `e${i}`, positionUm: x, intensity: x.map((v, k) => f(v) * (1 + cv * e[k][i])) }));
  return { a: make(anterior, 0.1, e1), b: make(posterior, 0.15, e2) };
}

describe("joint positional error of several channels", () => {
  it("analyseJointPrecision: two channels with exactly uncorrelated noise combine as σ⁻² = σ₁⁻² + σ₂⁻² (to 1%)", () => {
    // Source: Dubuis et al. 2013, PNAS — σ_x⁻² = ḡ′ᵀC⁻¹ḡ′, which for a diagonal C is the sum of the channels' σ⁻².
    const { a, b } = twoChannels(150, 1, true);
    const r = analyseJointPrecision([{ name: "A", profiles: a }, { name: "B", profiles: b }], { bootstrap: { resamples: 0 }, decoding: { enabled: false } });
    let checked = 0;
    r.gridX.forEach((_, k) => {
      const s1 = r.perChannel[0].sigmaX[k];
      const s2 = r.perChannel[1].sigmaX[k];
      const joint = r.sigmaX[k];
      if (s1 === null || s2 === null || joint === null) return;
      checked += 1;
      expect(Math.abs(joint ** -2 / (s1 ** -2 + s2 ** -2) - 1)).toBeLessThan(0.01);
    });
    expect(checked).toBeGreaterThan(150);
  });

  it("analyseJointPrecision: with merely independent noise (1000 embryos) the combination holds to 2% on average over the middle", () => {
    // Source: Dubuis et al. 2013, PNAS; sample correlations of order 1/√n perturb individual positions.
    const { a, b } = twoChannels(1000, 2, false);
    const r = analyseJointPrecision([{ name: "A", profiles: a }, { name: "B", profiles: b }], { bootstrap: { resamples: 0 }, decoding: { enabled: false } });
    const ratios = r.gridX
      .map((v, k) => [v, k] as const)
      .filter(([v, k]) => v >= 100 && v <= 300 && r.perChannel[0].sigmaX[k] !== null && r.perChannel[1].sigmaX[k] !== null && r.sigmaX[k] !== null)
      .map(([, k]) => (r.sigmaX[k] as number) ** -2 / ((r.perChannel[0].sigmaX[k] as number) ** -2 + (r.perChannel[1].sigmaX[k] as number) ** -2));
    const mean = ratios.reduce((s, v) => s + v, 0) / ratios.length;
    expect(ratios.length).toBeGreaterThan(80);
    expect(Math.abs(mean - 1)).toBeLessThan(0.02);
  });

  it("jointSigmaX matches numpy.linalg.solve for correlated channels, and ignoring the correlation gives a different answer", async () => {
    const covariances = [
      [[4, 1.5], [1.5, 2]],
      [[1, -0.6], [-0.6, 0.8]],
      [[2, 0.3, 0.1], [0.3, 1, -0.2], [0.1, -0.2, 0.5]],
    ];
    const slopes2 = [[-1, 0.5], [0.7, 0.9]];
    const two = jointSigmaX(slopes2, covariances.slice(0, 2));
    const three = jointSigmaX([[0.4], [-1.1], [0.25]], [covariances[2]]);
    // Source: numpy.linalg.solve as reference for σ_x = (g′ᵀ C⁻¹ g′)^(−1/2).
    const ref = await runPython<number[]>(
      `
out = []
for C, g in data:
    C = np.array(C); g = np.array(g)
    out.append(float(1 / np.sqrt(g @ np.linalg.solve(C, g))))
result = out
`,
      [
        [covariances[0], [-1, 0.7]],
        [covariances[1], [0.5, 0.9]],
        [covariances[2], [0.4, -1.1, 0.25]],
      ],
    );
    expect(two[0]).toBeCloseTo(ref[0], 12);
    expect(two[1]).toBeCloseTo(ref[1], 12);
    expect(three[0]).toBeCloseTo(ref[2], 12);
    const naive = independentSigmaX(slopes2, covariances.slice(0, 2));
    expect(Math.abs(naive[0] / two[0] - 1)).toBeGreaterThan(0.05);
  });

  it("inverseCovarianceBias matches the mean of 1/s² over seeded normal samples: (n−1)/(n−3) for one channel", () => {
    // Source: mean of the inverse Wishart (Anderson 2003, §7.2); checked here by simulation with n = 10.
    const random = createRandom(9);
    let sum = 0;
    const trials = 40000;
    for (let t = 0; t < trials; t++) {
      const v = Array.from({ length: 10 }, () => random.normal());
      const m = v.reduce((s, u) => s + u, 0) / 10;
      const s2 = v.reduce((s, u) => s + (u - m) ** 2, 0) / 9;
      sum += 1 / s2;
    }
    expect(inverseCovarianceBias(10, 1)).toBeCloseTo(9 / 7, 12);
    expect(Math.abs(sum / trials / inverseCovarianceBias(10, 1) - 1)).toBeLessThan(0.03);
    expect(inverseCovarianceBias(4, 2)).toBe(Infinity);
  });

  it("jointGaussianInformation of two independent linear channels equals one channel with the combined σ_x", () => {
    // Source: for linear means and independent Gaussian noise the precision-weighted sum of the channels is a
    // sufficient statistic for x, so I(x; g₁, g₂) = I(x; one channel with σ⁻² = σ₁⁻² + σ₂⁻²) (Dubuis et al. 2013, PNAS).
    const s1 = 6;
    const s2 = 8;
    const combined = 1 / Math.sqrt(s1 ** -2 + s2 ** -2);
    const m1 = x.map((v) => 5 - 0.01 * v);
    const m2 = x.map((v) => 1 + 0.02 * v);
    const cov = x.map(() => [[(0.01 * s1) ** 2, 0], [0, (0.02 * s2) ** 2]]);
    const joint = jointGaussianInformation(x, [m1, m2], cov, 0, 200, 8);
    const single = gaussianInformation(x, m1, x.map(() => 0.01 * combined), 0, 200, 16);
    expect(Math.abs(joint - single)).toBeLessThan(2e-3);
  });

  it("analyseJointPrecision warns when embryos are too few for the number of channels", () => {
    // Source: Tkačik et al. 2015, Genetics — joint estimates need many more embryos than genes.
    const { a, b } = twoChannels(8, 3, false);
    const r = analyseJointPrecision([{ name: "A", profiles: a }, { name: "B", profiles: b }], { bootstrap: { resamples: 20 }, decoding: { enabled: false } });
    expect(r.warnings.map((w) => w.code)).toContain("few-embryos-for-channels");
    expect(r.covarianceInversionBias).toBeCloseTo(7 / 4, 12);
    expect(() => analyseJointPrecision([{ name: "A", profiles: a.slice(0, 4) }, { name: "B", profiles: b.slice(0, 4) }])).toThrow(/at least 5 are needed/);
  });

  it("analyseJointPrecision flips an embryo reversed in every channel, and its result is free of NaN and Infinity", () => {
    // common practice, no source: an embryo is imaged end to end as a whole, so all its channels flip together.
    const { a, b } = twoChannels(30, 5, false);
    const reverse = (p: Profile): Profile => ({ ...p, intensity: Array.from(p.intensity).reverse() });
    const r = analyseJointPrecision(
      [{ name: "A", profiles: a.map((p, i) => (i === 6 ? reverse(p) : p)) }, { name: "B", profiles: b.map((p, i) => (i === 6 ? reverse(p) : p)) }],
      { flip: "auto", bootstrap: { resamples: 20, slowResamples: 5 } },
    );
    expect(r.flipped).toEqual(["e6"]);
    expect(r.decoding).not.toBeNull();
    expect(nonFinitePaths(r)).toEqual([]);
  });

  it("analyseJointPrecision matches embryos by label and leaves out those missing from a channel", () => {
    // common practice, no source.
    const { a, b } = twoChannels(30, 4, false);
    const r = analyseJointPrecision([{ name: "A", profiles: a }, { name: "B", profiles: b.slice(1).reverse() }], { bootstrap: { resamples: 10 }, decoding: { enabled: false } });
    expect(r.nEmbryos).toBe(29);
    expect(r.excludedEmbryos).toEqual(["e0"]);
    expect(r.warnings.map((w) => w.code)).toContain("embryos-unmatched");
  });
});
