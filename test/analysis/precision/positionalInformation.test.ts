import { describe, expect, it } from "vitest";
import { analysePrecision } from "../../../server/analysis/precision/analysePrecision.ts";
import { gaussianInformation, jointGaussianInformation } from "../../../server/analysis/precision/gaussianInformation.ts";
import { sampleSizeExtrapolation } from "../../../server/analysis/precision/sampleSizeExtrapolation.ts";
import { smallNoiseInformation } from "../../../server/analysis/precision/smallNoiseInformation.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython } from "../../helpers/python.ts";
import { exponentialGroup } from "./simulateGradients.ts";

const L = 400;
const x = Array.from({ length: 201 }, (_, k) => 2 * k);
// Source: Tkačik, Dubuis, Petkova, Gregor 2015, Genetics — for constant σ_x and a uniform prior on [0, L],
// the small-noise formula gives I = log₂(L/(√(2πe)·σ_x)).
const closedForm = (sigmaX: number) => Math.log2(L / (Math.sqrt(2 * Math.PI * Math.E) * sigmaX));

/** Linear mean a − b·x with Gaussian noise of SD b·σ_x at every position: σ_x is constant. */
function linearGroup(n: number, sigmaX: number, seed: number) {
  const random = createRandom(seed);
  const b = 0.01;
  return Array.from({ length: n }, (_, i) => ({
    embryo: `e${i}`,
    positionUm: x,
    intensity: x.map((v) => 5 - b * v + b * sigmaX * random.normal()),
  }));
}

describe("positional information, exact inputs", () => {
  it("smallNoiseInformation equals the closed form log₂(L/(√(2πe)σ_x)) for constant σ_x", () => {
    expect(smallNoiseInformation(x, x.map(() => 4), 0, 200)).toBeCloseTo(closedForm(4), 12);
  });

  it("gaussianInformation for a linear mean with constant SD matches scipy.integrate.quad of the exact mixture entropy to 2e-4 bits", async () => {
    const b = 0.01;
    const results = [4, 0.5, 20].map((sigmaX) => {
      const mean = x.map((v) => 5 - b * v);
      const sd = x.map(() => b * sigmaX);
      return { sigmaX, direct: gaussianInformation(x, mean, sd, 0, 200) };
    });
    // Source: scipy.integrate.quad as reference: x uniform on [0, L], g = 5 − b·x + N(0, s²) has density
    // P(g) = [Φ((5 − g)/s) − Φ((5 − bL − g)/s)]/(bL), and I = h(g) − ½log₂(2πe s²).
    const ref = await runPython<number[]>(
      `
from scipy import integrate, stats
out = []
a, b, L = 5.0, 0.01, 400.0
for s_x in data:
    s = b * s_x
    def p(g): return (stats.norm.cdf((a - g) / s) - stats.norm.cdf((a - b * L - g) / s)) / (b * L)
    def f(g):
        v = p(g)
        return -v * np.log2(v) if v > 0 else 0.0
    lo, hi = a - b * L, a
    h = sum(integrate.quad(f, u, v, limit=400, epsabs=1e-13, epsrel=1e-12)[0] for (u, v) in [(lo - 12 * s, lo), (lo, hi), (hi, hi + 12 * s)])
    out.append(h - 0.5 * np.log2(2 * np.pi * np.e * s * s))
result = out
`,
      [4, 0.5, 20],
    );
    results.forEach((r, i) => {
      expect(Math.abs(r.direct - ref[i])).toBeLessThan(2e-4);
      // Source: METHODS.md §4 — on a bounded domain the small-noise value reads low by a few σ_x/L bits.
      expect(r.direct).toBeGreaterThan(closedForm(r.sigmaX));
      expect(r.direct - closedForm(r.sigmaX)).toBeLessThan((4 * r.sigmaX) / L);
    });
  });

  it("gaussianInformation for a sigmoid mean with position-dependent SD matches a brute-force numpy/scipy.integrate.trapezoid computation to 2e-3 bits", async () => {
    const mean = x.map((v) => 1 / (1 + Math.exp((v - 200) / 30)));
    const sd = mean.map((m) => 0.03 + 0.05 * m);
    const direct = gaussianInformation(x, mean, sd, 0, 200);
    // Source: numpy + scipy.integrate.trapezoid as reference: mean and SD interpolated linearly on a 20× finer
    // x grid, P(g) = (1/L)∫N(g; μ(x), σ(x))dx and H(g) = −∫P log₂P dg on a fine g grid, H(g|x) analytic.
    const ref = await runPython<number>(
      `
from scipy import integrate, stats
x = np.array(data["x"]); mu = np.array(data["mu"]); sd = np.array(data["sd"])
L = x[-1] - x[0]
xf = np.linspace(x[0], x[-1], 20 * (len(x) - 1) + 1)
muf = np.interp(xf, x, mu); sdf = np.interp(xf, x, sd)
g = np.linspace(mu.min() - 10 * sd.max(), mu.max() + 10 * sd.max(), 6001)
P = np.array([integrate.trapezoid(stats.norm.pdf(gi, muf, sdf), xf) / L for gi in g])
Hg = -integrate.trapezoid(np.where(P > 0, P * np.log2(np.where(P > 0, P, 1)), 0.0), g)
Hgx = integrate.trapezoid(np.log2(np.sqrt(2 * np.pi * np.e) * sdf), xf) / L
result = float(Hg - Hgx)
`,
      { x, mu: mean, sd },
    );
    expect(Math.abs(direct - ref)).toBeLessThan(2e-3);
  });

  it("smallNoiseInformation uses the trapezoid rule exactly as scipy.integrate.trapezoid and agrees with scipy.integrate.simpson to 1e-3 bits", async () => {
    const sigma = x.map((v) => 4 + 3 * Math.sin(v / 60) ** 2);
    // Source: scipy.integrate.trapezoid and simpson on the same arrays as reference.
    const ref = await runPython<{ trapezoid: number; simpson: number }>(
      `
from scipy import integrate
x = np.array(data["x"]); s = np.array(data["s"]); L = x[-1] - x[0]
f = np.log2(np.sqrt(2 * np.pi * np.e) * s)
result = {"trapezoid": float(np.log2(L) - integrate.trapezoid(f, x) / L), "simpson": float(np.log2(L) - integrate.simpson(f, x=x) / L)}
`,
      { x, s: sigma },
    );
    const mine = smallNoiseInformation(x, sigma, 0, 200);
    expect(mine).toBeCloseTo(ref.trapezoid, 12);
    expect(Math.abs(mine - ref.simpson)).toBeLessThan(1e-3);
  });

  it("jointGaussianInformation with one channel equals gaussianInformation to 5e-5 bits", () => {
    // Source: the K-channel formula reduces to the one-channel one (Dubuis et al. 2013, PNAS). The one-channel
    // code takes the midpoint density on intervals where the mean moves by less than half an SD.
    const mean = x.map((v) => Math.exp(-v / 80));
    const sd = mean.map((m) => 0.1 * m);
    const one = gaussianInformation(x, mean, sd, 10, 180, 12);
    const joint = jointGaussianInformation(x, [mean], sd.map((s) => [[s * s]]), 10, 180, 12);
    expect(Math.abs(joint - one)).toBeLessThan(5e-5);
  });
});

describe("positional information from simulated embryos", () => {
  it("analysePrecision: small-noise and direct agree within 0.1 bit and both match the closed form for constant σ_x = 4 µm ≪ L (200 embryos)", () => {
    const r = analysePrecision(linearGroup(200, 4, 21), { region: [0, 400], bootstrap: { resamples: 100 }, decoding: { enabled: false }, information: { extrapolate: false } });
    const pi = r.positionalInformation;
    expect(pi.region?.length).toBe(400);
    const small = pi.smallNoise!.value;
    const direct = pi.direct!.value;
    expect(Math.abs(small - direct)).toBeLessThan(0.1);
    expect(Math.abs(small - closedForm(4))).toBeLessThan(0.1);
    expect(Math.abs(direct - closedForm(4))).toBeLessThan(0.1);
    expect(pi.smallNoise!.ci95).not.toBeNull();
    expect(pi.direct!.ci95).not.toBeNull();
  });

  it("analysePrecision: small-noise and direct agree within 0.1 bit for an exponential gradient with σ_x = λ·CV = 8 µm", () => {
    const group = exponentialGroup({ embryos: 200, lambdaUm: 80, cv: 0.1, noise: "pointwise", seed: 22 });
    const r = analysePrecision(group, { region: [0, 400], bootstrap: { resamples: 0 }, decoding: { enabled: false }, information: { extrapolate: false } });
    const pi = r.positionalInformation;
    expect(Math.abs(pi.smallNoise!.value - pi.direct!.value)).toBeLessThan(0.1);
    expect(Math.abs(pi.smallNoise!.value - closedForm(8))).toBeLessThan(0.1);
  });

  it("kernel-density direct estimate agrees with the Gaussian direct estimate within 0.15 bit for Gaussian noise (200 embryos)", () => {
    // Source: Tkačik et al. 2015, Genetics — both estimate the same I when P(c|x) is Gaussian; the kernel
    // estimate carries a larger upward small-sample bias.
    const r = analysePrecision(linearGroup(200, 4, 23), {
      region: [0, 400],
      bootstrap: { resamples: 20, slowResamples: 20 },
      decoding: { enabled: false },
      information: { kernelDensity: true, extrapolate: false },
    });
    const pi = r.positionalInformation;
    expect(pi.kernelDensity).not.toBeNull();
    expect(Math.abs(pi.kernelDensity!.value - pi.direct!.value)).toBeLessThan(0.15);
    expect(pi.kernelDensity!.ci95).not.toBeNull();
  });

  it("sampleSizeExtrapolation recovers the intercept and slope of an estimator with an exact 1/N bias", () => {
    // Source: Strong et al. 1998, Phys Rev Lett — extrapolation of I(N) = I∞ + b/N to N → ∞.
    const fit = sampleSizeExtrapolation(60, (idx) => 3.2 + 7 / idx.length, 3, createRandom(1));
    expect(fit.extrapolated!.value).toBeCloseTo(3.2, 10);
    expect(fit.biasSlope).toBeCloseTo(7, 9);
    expect(new Set(fit.points.map((p) => p.embryos))).toEqual(new Set([30, 36, 42, 48, 54, 60]));
    expect(sampleSizeExtrapolation(11, () => 1, 3, createRandom(1)).extrapolated).toBeNull();
    expect(sampleSizeExtrapolation(12, () => 1, 3, createRandom(1)).extrapolated).not.toBeNull();
  });

  it("extrapolation in 1/N removes most of the upward bias of the direct estimate from 40 embryos (mean over 20 groups)", async () => {
    // Source: Tkačik et al. 2015, Genetics — direct estimates are biased upward and the bias falls as 1/N.
    // The infinite-sample value is the exact mixture entropy (scipy.integrate.quad, as in the first test).
    const exact = await runPython<number>(
      `
from scipy import integrate, stats
a, b, L, s = 5.0, 0.01, 400.0, 0.04
def p(g): return (stats.norm.cdf((a - g) / s) - stats.norm.cdf((a - b * L - g) / s)) / (b * L)
def f(g):
    v = p(g)
    return -v * np.log2(v) if v > 0 else 0.0
lo, hi = a - b * L, a
h = sum(integrate.quad(f, u, v, limit=400)[0] for (u, v) in [(lo - 12 * s, lo), (lo, hi), (hi, hi + 12 * s)])
result = h - 0.5 * np.log2(2 * np.pi * np.e * s * s)
`,
      null,
    );
    const runs = Array.from({ length: 20 }, (_, i) =>
      analysePrecision(linearGroup(40, 4, 100 + i), { region: [0, 400], bootstrap: { resamples: 0 }, decoding: { enabled: false }, information: { extrapolationRepeats: 8 } })
        .positionalInformation,
    );
    const meanOf = (f: (pi: (typeof runs)[number]) => number) => runs.reduce((s, pi) => s + f(pi), 0) / runs.length;
    const directBias = meanOf((pi) => pi.direct!.value) - exact;
    const extrapolatedBias = meanOf((pi) => pi.directExtrapolated!.extrapolated!.value) - exact;
    expect(directBias).toBeGreaterThan(0);
    expect(Math.abs(extrapolatedBias)).toBeLessThan(directBias / 2);
  });
});
