import { describe, expect, it } from "vitest";
import { interpretFit, kineticsWithDiffusion, quantitiesFromDecayLength, steadyStateCaveat } from "../../server/analysis/derived.ts";
import { FitOptions } from "../../server/analysis/fit/fitOptions.ts";
import { fitProfile, type ProfileFit } from "../../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../../server/analysis/random/seededRandom.ts";
import { erfc } from "../../server/analysis/special/errorFunction.ts";
import { standardDeviation } from "../../server/analysis/stats/descriptive.ts";
import { positions, simulateProfile } from "./fit/fitTestData.ts";

const exactD = { valueUm2PerS: 2, seUm2PerS: null };

/** ∫ f over [a, b] by the composite Simpson rule with n (even) intervals. */
function simpson(f: (x: number) => number, a: number, b: number, n: number): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 === 1 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

describe("quantitiesFromDecayLength", () => {
  it("gives D/k = λ² with se 2λ·se(λ), and λ/L with se se(λ)/L, each with the caveat", () => {
    // Source: λ = √(D/k) (METHODS.md §1); delta method (Casella & Berger 2002, §5.5.4).
    const q = quantitiesFromDecayLength({ value: 50, se: 2, ci95: [46, 54] }, 400);
    expect(q.diffusionOverDegradationUm2).toEqual({ value: 2500, se: 200, ci95: [2116, 2916], unit: "µm²", fixed: false });
    expect(q.lambdaFractionOfLength).toEqual({ value: 0.125, se: 0.005, ci95: [0.115, 0.135], unit: "", fixed: false });
    expect(q.caveat).toBe(steadyStateCaveat);
    expect(q.caveat).toMatch(/only λ = √\(D\/k\)/);
    expect(q.caveat).toMatch(/FRAP/);
    expect(quantitiesFromDecayLength({ value: 50, se: null, ci95: null }).lambdaFractionOfLength).toBeNull();
  });
});

describe("kineticsWithDiffusion", () => {
  it("k = D/λ² and t½ = ln2/k", () => {
    // Source: λ = √(D/k) (METHODS.md §1); first-order decay half-life ln2/k.
    const q = kineticsWithDiffusion({ model: "exponential", lambdaUm: { value: 40, se: 0, ci95: [40, 40] }, diffusion: exactD });
    expect(q.degradationPerS.value).toBeCloseTo(2 / 1600, 15);
    expect(q.halfLifeS.value).toBeCloseTo((Math.LN2 * 1600) / 2, 10);
    expect(q.caveat).toBe(steadyStateCaveat);
  });

  it("the source flux equals the influx −D·c'(0) of the fitted profile (exponential and finite)", () => {
    // Source: definition of the influx boundary −D c'(0) = j0 (METHODS.md conventions); central difference.
    const h = 1e-4;
    const lambdaUm = 60;
    const amplitude = 80;
    for (const [model, L] of [["exponential", undefined], ["finite", 90]] as const) {
      const c = simulateProfile(model, [-h, h], [lambdaUm], amplitude, 0, { lengthUm: L });
      const influx = -exactD.valueUm2PerS * ((c[1] - c[0]) / (2 * h));
      const q = kineticsWithDiffusion({ model, lambdaUm: { value: lambdaUm, se: 0, ci95: null }, amplitude: { value: amplitude, se: 0, ci95: null }, lengthUm: L, diffusion: exactD });
      expect(Math.abs(q.sourceFlux!.value / influx - 1)).toBeLessThan(1e-7);
    }
  });

  it("the source flux balances degradation: k∫c dx = j0 (finite domain and localized source)", () => {
    // Source: ∫c dx = j0/k on [0, L] and k∫c = νs for the localized source (METHODS.md §1).
    const lambdaUm = 40;
    const k = exactD.valueUm2PerS / lambdaUm ** 2;
    const finite = (x: number) => simulateProfile("finite", [x], [lambdaUm], 50, 0, { lengthUm: 100 })[0];
    const j0Finite = kineticsWithDiffusion({ model: "finite", lambdaUm: { value: lambdaUm, se: 0, ci95: null }, amplitude: { value: 50, se: 0, ci95: null }, lengthUm: 100, diffusion: exactD }).sourceFlux!.value;
    expect(Math.abs((k * simpson(finite, 0, 100, 2000)) / j0Finite - 1)).toBeLessThan(1e-9);
    const source = (x: number) => simulateProfile("source", [x], [lambdaUm, 30], 50, 0)[0];
    const j0Source = kineticsWithDiffusion({ model: "source", lambdaUm: { value: lambdaUm, se: 0, ci95: null }, amplitude: { value: 50, se: 0, ci95: null }, diffusion: exactD }).sourceFlux!.value;
    const integral = simpson(source, 0, 30, 600) + simpson(source, 30, 1500, 20000);
    expect(Math.abs((k * integral) / j0Source - 1)).toBeLessThan(1e-8);
  });

  it("τ(x) = (1 + x/λ)/(2k) matches ∫(1 − c(x,t)/c_s(x))dt of the time-dependent solution", () => {
    // Source: Berezhkovskii, Sample & Shvartsman 2010, Biophys J; checked against the pre-steady-state
    // solution of METHODS.md §2, c/c_s = ½[erfc(x/√(4Dt) − √(kt)) − e^(2x/λ) erfc(x/√(4Dt) + √(kt))],
    // integrated numerically over ln t.
    const D = 2;
    const lambdaUm = 30;
    const k = D / lambdaUm ** 2;
    for (const x of [0, 15, 45]) {
      const integrand = (u: number) => {
        const t = Math.exp(u);
        const a = x / Math.sqrt(4 * D * t);
        const b = Math.sqrt(k * t);
        const ratio = 0.5 * (erfc(a - b) - Math.exp((2 * x) / lambdaUm) * erfc(a + b));
        return (1 - ratio) * t;
      };
      const numeric = simpson(integrand, -25, Math.log(60 / k), 6000);
      const q = kineticsWithDiffusion({ model: "exponential", lambdaUm: { value: lambdaUm, se: 0, ci95: null }, diffusion: { valueUm2PerS: D, seUm2PerS: null }, accumulationPositionsUm: [x] });
      expect(Math.abs(numeric / q.accumulationTimes[0].timeS.value - 1)).toBeLessThan(1e-4);
    }
  });

  it("delta-method se of k, t½ and j0 agree with a seeded parametric bootstrap within 10%", () => {
    // Source: parametric bootstrap (Efron & Tibshirani 1993, ch. 6) as the reference for the delta method.
    const random = createRandom(97);
    const x = positions(0, 250, 80);
    const noiseSd = 2;
    const y = simulateProfile("exponential", x, [45], 100, 10, { noiseSd, random });
    const options = FitOptions.parse({});
    const fit = fitProfile(x, y, options) as ProfileFit;
    expect(fit.ok).toBe(true);
    const diffusion = { valueUm2PerS: 1.5, seUm2PerS: 0.1 };
    const interpreted = interpretFit(fit, diffusion);
    if (!interpreted.ok || interpreted.kinetics === null) throw new Error("expected kinetics");
    const { degradationPerS, halfLifeS, sourceFlux } = interpreted.kinetics;
    const lambdaHat = fit.parameters.lambdaUm.value;
    const aHat = fit.parameters.amplitude.value;
    const bHat = fit.parameters.background.value;
    const ks: number[] = [];
    const halves: number[] = [];
    const fluxes: number[] = [];
    for (let r = 0; r < 1000; r++) {
      const yb = simulateProfile("exponential", x, [lambdaHat], aHat, bHat, { noiseSd: fit.residualSd, random });
      const fb = fitProfile(x, yb, options);
      if (!fb.ok) continue;
      const d = diffusion.valueUm2PerS + diffusion.seUm2PerS * random.normal();
      const l = fb.parameters.lambdaUm.value;
      ks.push(d / (l * l));
      halves.push((Math.LN2 * l * l) / d);
      fluxes.push((fb.parameters.amplitude.value * d) / l);
    }
    expect(ks.length).toBe(1000);
    expect(Math.abs(degradationPerS.se! / standardDeviation(ks) - 1)).toBeLessThan(0.1);
    expect(Math.abs(halfLifeS.se! / standardDeviation(halves) - 1)).toBeLessThan(0.1);
    expect(Math.abs(sourceFlux!.se! / standardDeviation(fluxes) - 1)).toBeLessThan(0.1);
  });

  it("builds positive 95% intervals on the log scale", () => {
    // Source: delta method on ln v: v·exp(±1.96·se/v) (Casella & Berger 2002, §5.5.4).
    const q = kineticsWithDiffusion({ model: "exponential", lambdaUm: { value: 10, se: 4, ci95: null }, diffusion: { valueUm2PerS: 1, seUm2PerS: 0.5 } });
    const { value, se, ci95 } = q.degradationPerS;
    expect(ci95![0]).toBeGreaterThan(0);
    expect(ci95![0] * ci95![1]).toBeCloseTo(value * value, 12);
    expect(Math.log(ci95![1] / value)).toBeCloseTo((1.959963984540054 * se!) / value, 10);
  });
});

describe("interpretFit", () => {
  it("declines the power-law models, whose degradation is not first order", () => {
    // Source: Eldar et al. 2003 (nonlinear degradation has no single k).
    const x = positions(0, 200, 50);
    const fit = fitProfile(x, simulateProfile("power", x, [20], 50, 3), FitOptions.parse({ model: "power" })) as ProfileFit;
    const result = interpretFit(fit, exactD);
    expect(result.ok).toBe(false);
    expect(result.caveat).toBe(steadyStateCaveat);
  });

  it("without D reports only the quantities that follow from λ", () => {
    // Source: METHODS.md §1 (a profile alone fixes only λ = √(D/k)).
    const x = positions(0, 200, 50);
    const fit = fitProfile(x, simulateProfile("finite", x, [70], 50, 3, { lengthUm: 200 }), FitOptions.parse({ model: "finite" }), { lengthUm: 200 }) as ProfileFit;
    const result = interpretFit(fit);
    if (!result.ok) throw new Error(result.reason);
    expect(result.kinetics).toBeNull();
    expect(result.decayLength.lambdaFractionOfLength!.value).toBeCloseTo(70 / 200, 8);
  });
});
