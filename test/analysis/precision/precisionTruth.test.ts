import { describe, expect, it } from "vitest";
import { analysePrecision, type PrecisionResult } from "../../../server/analysis/precision/analysePrecision.ts";
import { runPython } from "../../helpers/python.ts";
import { exponentialGroup } from "./simulateGradients.ts";

/*
 * The default numbers checked against the truth of the simulation, not against the code's own curve.
 * Ensemble: mean profile A·e^(−x/λ) over 0–500 µm, λ = 100 µm, multiplicative log-normal noise of
 * CV 10% at every position, so σ_x = λ·CV = 10 µm everywhere (METHODS.md §4 [derived]).
 */
const LAMBDA = 100;
const CV = 0.1;
const TRUE_SIGMA = LAMBDA * CV;
const spec = { lambdaUm: LAMBDA, cv: CV, noise: "pointwise" as const, lengthUm: 500, spacingUm: 5 };
/** The default region: 0–500 µm trimmed by 10% at each end. */
const REGION = [50, 450] as const;

/**
 * Source: exact positional information by scipy.integrate.quad. I is unchanged by a monotone map of
 * the readout, and y = ln c = const − x/λ + s·z with s² = ln(1 + CV²) (log-normal noise), so for x
 * uniform on the region, y is uniform on a width W = L/λ blurred by N(0, s²):
 * P(y) = [Φ(y/s) − Φ((y − W)/s)]/W and I = h(y) − ½log₂(2πe s²) (definition of I: Tkačik, Dubuis,
 * Petkova, Gregor 2015, Genetics).
 */
async function exactInformation(): Promise<number> {
  return runPython<number>(
    `
from scipy import integrate, stats
W = (data["to"] - data["from"]) / data["lam"]
s = np.sqrt(np.log(1 + data["cv"] ** 2))
def p(y): return (stats.norm.cdf(y / s) - stats.norm.cdf((y - W) / s)) / W
def f(y):
    v = p(y)
    return -v * np.log2(v) if v > 0 else 0.0
h = sum(integrate.quad(f, a, b, limit=400, epsabs=1e-12)[0] for (a, b) in [(-12 * s, 0), (0, W), (W, W + 12 * s)])
result = float(h - 0.5 * np.log2(2 * np.pi * np.e * s * s))
`,
    { from: REGION[0], to: REGION[1], lam: LAMBDA, cv: CV },
  );
}

const run = (group: ReturnType<typeof exponentialGroup>, resamples: number, seed = 1) =>
  analysePrecision(group, { bootstrap: { resamples, seed, slowResamples: 0 }, decoding: { enabled: false } });

const overlap = (a: [number, number], b: [number, number]) => a[0] <= b[1] && b[0] <= a[1];

describe("positional information on the stated default region", () => {
  const all = exponentialGroup({ ...spec, embryos: 200, seed: 901 });
  const sizes = [8, 12, 20, 30, 200];
  const results = new Map<number, PrecisionResult>();
  const resultFor = (n: number) => {
    if (!results.has(n)) results.set(n, run(all.slice(0, n), 100));
    return results.get(n)!;
  };

  it("uses the same region for 8, 12, 20, 30 and 200 embryos of one set: the covered span trimmed by 10% at each end", () => {
    // common practice, no source: a region chosen before looking at the noise does not move with n.
    for (const n of sizes) {
      const region = resultFor(n).positionalInformation.region;
      expect([region.from, region.to, region.source]).toEqual([...REGION, "default"]);
    }
  });

  it("small-noise and extrapolated direct information are within 0.25 bits of the exact value for n ≥ 12, each interval containing its estimate", async () => {
    const exact = await exactInformation();
    for (const n of sizes) {
      const pi = resultFor(n).positionalInformation;
      const small = pi.smallNoise!;
      expect(small.ci95![0]).toBeLessThan(small.value);
      expect(small.ci95![1]).toBeGreaterThan(small.value);
      if (n < 12) {
        // Source: sampleSizeExtrapolation needs three subsample sizes of at least 10 embryos.
        expect(pi.directExtrapolated!.extrapolated).toBeNull();
        continue;
      }
      const direct = pi.directExtrapolated!.extrapolated!;
      expect(Math.abs(small.value - exact), `small-noise at n = ${n}`).toBeLessThan(0.25);
      expect(Math.abs(direct.value - exact), `extrapolated direct at n = ${n}`).toBeLessThan(0.25);
      expect(direct.ci95![0]).toBeLessThan(direct.value);
      expect(direct.ci95![1]).toBeGreaterThan(direct.value);
    }
  });

  it("two disjoint halves of 200 embryos agree within their intervals", () => {
    // Source: two independent samples of one population; their 95% intervals overlap unless the method is biased or overconfident.
    const a = run(all.slice(0, 100), 100, 3).positionalInformation;
    const b = run(all.slice(100), 100, 4).positionalInformation;
    expect(overlap(a.smallNoise!.ci95!, b.smallNoise!.ci95!)).toBe(true);
    expect(overlap(a.directExtrapolated!.extrapolated!.ci95!, b.directExtrapolated!.extrapolated!.ci95!)).toBe(true);
    expect([a.region.from, a.region.to]).toEqual([b.region.from, b.region.to]);
  });
});

describe("headline σ_x against σ_x = λ·CV", () => {
  it("is within 5% of λ·CV at 30 and 200 embryos, with an interval that contains it", () => {
    // Source: σ_x = λ·CV for an exponential mean with multiplicative noise of constant CV (METHODS.md §4 [derived]).
    for (const n of [30, 200]) {
      const s = run(exponentialGroup({ ...spec, embryos: n, seed: 910 + n }), 100).sigmaXSummary!;
      expect(Math.abs(s.value / TRUE_SIGMA - 1), `n = ${n}`).toBeLessThan(0.05);
      expect(s.ci95![0]).toBeLessThan(s.value);
      expect(s.ci95![1]).toBeGreaterThan(s.value);
    }
  });

  it("its 95% interval contains the truth in at least 90% of 200 seeded replicates at 30 embryos (40 resamples each)", () => {
    // Source: definition of a 95% confidence interval; ≥ 90% allows for 200 replicates and few resamples
    // (binomial SE of a 95% coverage over 200 replicates is 1.5%). A larger run: test/validate/precisionCoverage.test.ts.
    let covered = 0;
    let contains = 0;
    for (let r = 0; r < 200; r++) {
      const s = analysePrecision(exponentialGroup({ ...spec, embryos: 30, seed: 2000 + r }), {
        bootstrap: { resamples: 40, seed: r + 1, slowResamples: 0 },
        decoding: { enabled: false },
        information: { extrapolate: false },
      }).sigmaXSummary!;
      if (s.ci95![0] <= TRUE_SIGMA && TRUE_SIGMA <= s.ci95![1]) covered++;
      if (s.ci95![0] <= s.value && s.value <= s.ci95![1]) contains++;
    }
    expect(contains).toBe(200);
    expect(covered / 200).toBeGreaterThanOrEqual(0.9);
  });
});
