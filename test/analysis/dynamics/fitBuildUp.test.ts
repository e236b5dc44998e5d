import { describe, expect, it } from "vitest";
import { fitBuildUp } from "../../../server/analysis/dynamics/buildUp/fitBuildUp.ts";
import { BuildUpFitOptions } from "../../../server/analysis/dynamics/buildUp/buildUpFitOptions.ts";
import { buildUpResponse, type BuildUpData } from "../../../server/analysis/dynamics/buildUp/buildUpResponse.ts";
import { influxBuildUp } from "../../../server/analysis/dynamics/buildUp/influxBuildUp.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";

function synthetic(times: number[], positions: number[], model: (x: number, t: number) => number, noiseSd: number, seed: number): BuildUpData {
  const rng = createRandom(seed);
  const xs: number[] = [];
  const ts: number[] = [];
  const vs: number[] = [];
  for (const t of times)
    for (const x of positions) {
      xs.push(x);
      ts.push(t);
      vs.push(model(x, t) + noiseSd * rng.normal());
    }
  return { xUm: Float64Array.from(xs), tS: Float64Array.from(ts), values: Float64Array.from(vs) };
}

const positions = Array.from({ length: 31 }, (_, i) => i * 5);
const d = 0.3;
const k = 2e-4; // λ = 38.7 µm, half-life 58 min
const j0 = 1;
const background = 2;
const peak = (j0 * Math.sqrt(d / k)) / d;

describe("fitBuildUp", () => {
  it("recovers D, k, j0 and the background from noisy build-up profiles (semi-infinite influx), inside their 95% intervals", () => {
    // Source: build-up closed form (science notes §2); τ(x) = (1 + x/λ)/(2k), Berezhkovskii, Sample & Shvartsman 2010, Biophys J.
    const times = [600, 1800, 3600, 7200, 14_400, 28_800];
    const data = synthetic(times, positions, (x, t) => background + influxBuildUp(x, t, d, k, j0), 0.02 * peak, 7);
    const fit = fitBuildUp(data, BuildUpFitOptions.parse({}));
    if (!fit.ok) throw new Error(fit.reason);
    for (const [est, truth] of [[fit.diffusionUm2PerS, d], [fit.degradationPerS, k], [fit.sourceStrength, j0], [fit.background!, background]] as const) {
      expect(est.ci95![0]).toBeLessThan(truth);
      expect(est.ci95![1]).toBeGreaterThan(truth);
      expect(Math.abs(est.value / truth - 1)).toBeLessThan(0.1);
    }
    expect(fit.identifiable).toBe(true);
    expect(fit.warnings).toEqual([]);
    expect(fit.profileIntervalK[0]!).toBeLessThan(k);
    expect(fit.profileIntervalK[1]!).toBeGreaterThan(k);
    const tau = fit.accumulationTimes.find((a) => a.positionUm === 75)!;
    const tauTrue = (1 + 75 / Math.sqrt(d / k)) / (2 * k);
    expect(tau.timeS.ci95![0]).toBeLessThan(tauTrue);
    expect(tau.timeS.ci95![1]).toBeGreaterThan(tauTrue);
    expect(fit.correlationDK).toBeGreaterThan(-1);
    expect(fit.correlationDK).toBeLessThan(1);
  });

  it("warns that k is not identified when the data stop early in the build-up, and its profile likelihood stays flat on one side", () => {
    // Source: science notes §2 (k shows only as the gradient nears steady state; τ(0) = 1/(2k) = 2500 s here).
    const times = [60, 150, 300];
    const data = synthetic(times, positions, (x, t) => background + influxBuildUp(x, t, d, k, j0), 0.02 * peak, 11);
    const fit = fitBuildUp(data, BuildUpFitOptions.parse({}));
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.identifiable).toBe(false);
    expect(fit.warnings.join(" ")).toMatch(/k is not identified/);
    expect(fit.profileIntervalK.includes(null)).toBe(true);
  });

  it("recovers D and k with a source region on a finite domain (solver model)", () => {
    // Source: the solver's own response, checked against the steady states in steadyStates.test.ts; recovery within CI.
    const options = BuildUpFitOptions.parse({ domain: { kind: "finite", lengthUm: 120 }, source: { kind: "region", widthUm: 10 }, profilePoints: 7, cells: 60 });
    const times = [900, 3600, 10_800, 28_800];
    const xs = Array.from({ length: 25 }, (_, i) => i * 5);
    const clean = synthetic(times, xs, () => 0, 0, 1);
    const nu = 0.01;
    const u = buildUpResponse(clean, d, k, options);
    const rng = createRandom(3);
    const data = { ...clean, values: u.map((v) => background + nu * v + 0.3 * rng.normal()) };
    const fit = fitBuildUp(data, options);
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.diffusionUm2PerS.ci95![0]).toBeLessThan(d);
    expect(fit.diffusionUm2PerS.ci95![1]).toBeGreaterThan(d);
    expect(fit.degradationPerS.ci95![0]).toBeLessThan(k);
    expect(fit.degradationPerS.ci95![1]).toBeGreaterThan(k);
    expect(Math.abs(fit.degradationPerS.value / k - 1)).toBeLessThan(0.15);
  });

  it("refuses a single time point: one time gives only λ", () => {
    const data = synthetic([3600], positions, (x, t) => influxBuildUp(x, t, d, k, j0), 0.01, 1);
    const fit = fitBuildUp(data, BuildUpFitOptions.parse({}));
    expect(fit.ok).toBe(false);
    if (!fit.ok) expect(fit.reason).toMatch(/two or more times/);
  });
});
