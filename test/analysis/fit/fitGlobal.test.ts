import { describe, expect, it } from "vitest";
import { fitGlobal, type GlobalFit, type GlobalFitResult, type ReplicateProfile } from "../../../server/analysis/fit/fitGlobal.ts";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { fitProfile } from "../../../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";
import { nonFinitePaths, positions, simulateProfile } from "./fitTestData.ts";

function expectFitted(result: GlobalFitResult): GlobalFit {
  if (!result.ok) throw new Error(`expected a fit, got ${result.status}: ${result.message}`);
  return result;
}

const amplitudes = [80, 120, 65, 150, 95];
const backgrounds = [10, 4, 22, 15, 8];

describe("fitGlobal", () => {
  it("recovers a shared λ and each profile's amplitude and background from noise-free replicates to 1e-8", () => {
    // Source: recovery of known parameters from exact synthetic data (common practice, no source).
    const profiles: ReplicateProfile[] = amplitudes.map((a, k) => {
      const x = positions(0, 250 + 30 * k, 80 + 10 * k);
      return { x, y: simulateProfile("exponential", x, [47], a, backgrounds[k]) };
    });
    const fit = expectFitted(fitGlobal(profiles, FitOptions.parse({})));
    expect(relativeDifference(fit.shared.lambdaUm.value, 47)).toBeLessThan(1e-8);
    fit.profiles.forEach((p, k) => {
      expect(relativeDifference(p.amplitude.value, amplitudes[k])).toBeLessThan(1e-8);
      expect(relativeDifference(p.background.value, backgrounds[k])).toBeLessThan(1e-8);
    });
    expect(fit.p).toBe(1 + 2 * 5);
    expect(fit.n).toBe(profiles.reduce((a, p) => a + p.x.length, 0));
    expect(nonFinitePaths(fit)).toEqual([]);
  });

  it("recovers the finite model with a different embryo length per profile", () => {
    // Source: recovery of known parameters from exact synthetic data (common practice, no source).
    const lengths = [300, 340, 280];
    const profiles = lengths.map((L, k) => {
      const x = positions(0, L, 90);
      return { x, y: simulateProfile("finite", x, [120], amplitudes[k], backgrounds[k], { lengthUm: L }), lengthUm: L };
    });
    const fit = expectFitted(fitGlobal(profiles, FitOptions.parse({ model: "finite" })));
    expect(relativeDifference(fit.shared.lambdaUm.value, 120)).toBeLessThan(1e-8);
  });

  it("with a single profile equals fitProfile, standard errors included", () => {
    // Source: with one profile the global model is the single-profile model (identity of the two problems).
    const random = createRandom(3);
    const x = positions(0, 300, 100);
    const y = simulateProfile("exponential", x, [55], 100, 12, { noiseSd: 2, random });
    const single = fitProfile(x, y, FitOptions.parse({}));
    const global = expectFitted(fitGlobal([{ x, y }], FitOptions.parse({})));
    if (!single.ok) throw new Error(single.message);
    expect(relativeDifference(global.shared.lambdaUm.value, single.parameters.lambdaUm.value)).toBeLessThan(1e-9);
    expect(relativeDifference(global.shared.lambdaUm.se!, single.parameters.lambdaUm.se!)).toBeLessThan(1e-9);
    expect(relativeDifference(global.profiles[0].amplitude.se!, single.parameters.amplitude.se!)).toBeLessThan(1e-9);
    expect(relativeDifference(global.profiles[0].background.se!, single.parameters.background.se!)).toBeLessThan(1e-9);
    expect(global.aicc).toBeCloseTo(single.aicc!, 8);
  });

  it("on identical noise-free copies of one profile gives the single-fit λ", () => {
    // Source: identical data carry identical information (common practice, no source).
    const x = positions(0, 200, 60);
    const y = simulateProfile("power", x, [18], 70, 5);
    const single = fitProfile(x, y, FitOptions.parse({ model: "power" }));
    const global = expectFitted(fitGlobal([{ x, y }, { x, y }, { x, y }], FitOptions.parse({ model: "power" })));
    if (!single.ok) throw new Error(single.message);
    expect(relativeDifference(global.shared.x0Um.value, single.parameters.x0Um.value)).toBeLessThan(1e-9);
  });

  it("matches scipy.optimize.curve_fit on the stacked model: λ to 1e-6, every SE to 1e-3", async () => {
    // Source: scipy.optimize.curve_fit as reference, fitting [λ, A₁…A₃, B₁…B₃] to the concatenated profiles.
    const random = createRandom(77);
    const profiles = [0, 1, 2].map((k) => {
      const x = positions(5 * k, 240 + 20 * k, 70 + 15 * k);
      return { x, y: simulateProfile("exponential", x, [52], amplitudes[k], backgrounds[k], { noiseSd: 2.5, random }) };
    });
    const ref = await runPython<{ popt: number[]; perr: number[] }>(
      `
from scipy.optimize import curve_fit
xs = [np.array(p["x"]) for p in data]
x = np.concatenate(xs); y = np.concatenate([np.array(p["y"]) for p in data])
idx = np.concatenate([np.full(len(a), k) for k, a in enumerate(xs)])
M = len(xs)
def f(x, l, *ab):
    A = np.array(ab[:M])[idx]; B = np.array(ab[M:])[idx]
    return A * np.exp(-x / l) + B
def jac(x, l, *ab):
    A = np.array(ab[:M])[idx]; e = np.exp(-x / l)
    J = np.zeros((len(x), 1 + 2 * M)); J[:, 0] = A * x / l**2 * e
    for k in range(M):
        J[idx == k, 1 + k] = e[idx == k]; J[idx == k, 1 + M + k] = 1
    return J
popt, pcov = curve_fit(f, x, y, p0=[40] + [100] * M + [10] * M, jac=jac, method="lm", xtol=1e-15, ftol=1e-15, gtol=1e-15, maxfev=100000)
result = {"popt": popt, "perr": np.sqrt(np.diag(pcov))}
`,
      profiles,
    );
    const fit = expectFitted(fitGlobal(profiles, FitOptions.parse({ weights: "none", errorModel: "classic" })));
    expect(relativeDifference(fit.shared.lambdaUm.value, ref.popt[0])).toBeLessThan(1e-6);
    expect(relativeDifference(fit.shared.lambdaUm.se!, ref.perr[0])).toBeLessThan(1e-3);
    fit.profiles.forEach((p, k) => {
      expect(relativeDifference(p.amplitude.value, ref.popt[1 + k])).toBeLessThan(1e-6);
      expect(relativeDifference(p.amplitude.se!, ref.perr[1 + k])).toBeLessThan(1e-3);
      expect(relativeDifference(p.background.se!, ref.perr[4 + k])).toBeLessThan(1e-3);
    });
  });

  it("its 95% CI of the shared λ covers the truth in 93–97% of 500 simulated groups", () => {
    // Source: definition of a 95% confidence interval; binomial SD ≈ 1% at 500 replicates.
    const random = createRandom(2024);
    const options = FitOptions.parse({});
    let covered = 0;
    for (let r = 0; r < 500; r++) {
      const profiles = [0, 1, 2, 3].map((k) => {
        const x = positions(0, 200, 30);
        return { x, y: simulateProfile("exponential", x, [40], amplitudes[k], backgrounds[k], { noiseSd: 4, random }) };
      });
      const fit = expectFitted(fitGlobal(profiles, options));
      const [lo, hi] = fit.shared.lambdaUm.ci95!;
      if (lo <= 40 && 40 <= hi) covered++;
    }
    expect(covered / 500).toBeGreaterThanOrEqual(0.93);
    expect(covered / 500).toBeLessThanOrEqual(0.97);
  });

  it("names the profile at fault in failures, and warns about a profile that rises", () => {
    // common practice, no source
    const x = positions(0, 100, 30);
    const good = { x, y: simulateProfile("exponential", x, [25], 50, 5) };
    expect(fitGlobal([], FitOptions.parse({}))).toMatchObject({ ok: false, status: "invalid-input", message: "no profiles to fit" });
    const short = fitGlobal([good, { x: [0, 1], y: [3, 2] }], FitOptions.parse({}));
    expect(short).toMatchObject({ ok: false, status: "too-few-points" });
    expect(short.message).toMatch(/^profile 1 has 2 point\(s\)/);
    const noLength = fitGlobal([{ ...good, lengthUm: 100 }, good], FitOptions.parse({ model: "finite" }));
    expect(noLength.message).toMatch(/^profile 1: the finite-domain model needs the embryo length/);
    const rising = { x, y: x.map((v) => 5 + 0.3 * v) };
    const mixed = expectFitted(fitGlobal([good, good, rising], FitOptions.parse({})));
    expect(mixed.warnings.join(" ")).toMatch(/profile\(s\) 2 have amplitude ≤ 0/);
    const allRising = fitGlobal([rising, rising], FitOptions.parse({}));
    expect(allRising.status).toBe("no-decay");
    expect(nonFinitePaths(allRising)).toEqual([]);
  });
});
