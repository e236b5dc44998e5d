import { describe, expect, it } from "vitest";
import { fitFrapCurve } from "../../../server/analysis/dynamics/frap/fitFrapCurve.ts";
import { FrapFitOptions } from "../../../server/analysis/dynamics/frap/frapFitOptions.ts";
import { recoveryWithTurnover } from "../../../server/analysis/dynamics/frap/recoveryModel.ts";
import { frapCoverage } from "./frapCoverage.ts";

describe("fitFrapCurve", () => {
  it("recovers D, the mobile fraction and the post-bleach intensity from a noise-free spot curve to 1e-6", () => {
    // Source: self-consistency with the Soumpasis 1983 model (Biophys J 41:95).
    const geometry = { kind: "spot" as const, radiusUm: 1.5 };
    const times = Array.from({ length: 80 }, (_, i) => 0.25 + i * 0.5);
    const values = times.map((t) => 0.2 + 0.8 * 0.7 * recoveryWithTurnover(geometry, t, 0.4, 0));
    const fit = fitFrapCurve({ timesS: times, values }, FrapFitOptions.parse({ geometry }));
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.diffusionUm2PerS.value / 0.4 - 1).toBeLessThan(1e-6);
    expect(Math.abs(fit.mobileFraction.value - 0.7)).toBeLessThan(1e-6);
    expect(Math.abs(fit.postBleachIntensity.value - 0.2)).toBeLessThan(1e-6);
    // t½ = 0.8946·w²/(4D) for the spot (Soumpasis 1983).
    expect(fit.halfTimeS.value / ((0.8946 * 1.5 * 1.5) / (4 * 0.4))).toBeCloseTo(1, 3);
  });

  it("recovers D and turnover together from a closed-rod curve with degradation", () => {
    // Source: science notes §3 (deficit decays by e^(−kt) [derived]).
    const geometry = { kind: "rod" as const, fromUm: 1, toUm: 2.5, lengthUm: 6 };
    const times = Array.from({ length: 120 }, (_, i) => 0.1 + i * 0.6);
    const values = times.map((t) => 0.1 + 0.9 * 0.85 * recoveryWithTurnover(geometry, t, 0.2, 0.01));
    const fit = fitFrapCurve({ timesS: times, values }, FrapFitOptions.parse({ geometry, degradation: { mode: "fit" } }));
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.diffusionUm2PerS.value / 0.2 - 1).toBeLessThan(1e-5);
    expect(fit.degradationPerS!.value / 0.01 - 1).toBeLessThan(1e-4);
    expect(Math.abs(fit.mobileFraction.value - 0.85)).toBeLessThan(1e-5);
  });

  it("ignoring turnover makes D come out too high (the documented caution)", () => {
    // Source: science notes §3 [derived].
    const geometry = { kind: "strip" as const, widthUm: 2 };
    const times = Array.from({ length: 100 }, (_, i) => 0.5 + i);
    const values = times.map((t) => 0.1 + 0.9 * recoveryWithTurnover(geometry, t, 0.1, 0.02));
    const fit = fitFrapCurve({ timesS: times, values }, FrapFitOptions.parse({ geometry }));
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.diffusionUm2PerS.value).toBeGreaterThan(0.103);
  });

  it("warns when the curve stops before the recovery levels off", () => {
    // Source: common practice, no source (the plateau must be observed to separate D from Mf).
    const geometry = { kind: "spot" as const, radiusUm: 2 };
    const times = Array.from({ length: 20 }, (_, i) => 0.1 + i * 0.1);
    const values = times.map((t) => 0.2 + 0.8 * recoveryWithTurnover(geometry, t, 0.1, 0) + 0.002 * Math.sin(7 * t));
    const fit = fitFrapCurve({ timesS: times, values }, FrapFitOptions.parse({ geometry }));
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.warnings.join(" ")).toMatch(/before 3 half-times/);
  });

  it("refuses a curve with too few frames, naming the count", () => {
    const fit = fitFrapCurve({ timesS: [1, 2, 3], values: [0.2, 0.5, 0.6] }, FrapFitOptions.parse({ geometry: { kind: "spot", radiusUm: 1 } }));
    expect(fit.ok).toBe(false);
    if (!fit.ok) expect(fit.reason).toMatch(/at least 6 post-bleach frames, this one has 3/);
  });

  it("95% intervals of D and of the mobile fraction cover the truth in 93–97% of 300 noisy spot replicates", () => {
    // Source: definition of a 95% confidence interval; binomial SE of the coverage over 300 replicates ≈ 1.3%.
    const result = frapCoverage({ geometry: { kind: "spot", radiusUm: 1.5 }, diffusionUm2PerS: 0.4, mobileFraction: 0.75, postBleach: 0.25, noiseSd: 0.02, frames: 60, frameIntervalS: 0.5 }, 300, 20261202);
    expect(result.failed).toBe(0);
    expect(result.coverageD).toBeGreaterThanOrEqual(0.93);
    expect(result.coverageD).toBeLessThanOrEqual(0.97);
    expect(result.coverageMf).toBeGreaterThanOrEqual(0.93);
    expect(result.coverageMf).toBeLessThanOrEqual(0.97);
    expect(Math.abs(result.medianLogRatio)).toBeLessThan(0.02);
  });
});
