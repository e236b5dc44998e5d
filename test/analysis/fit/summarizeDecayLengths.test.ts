import { describe, expect, it } from "vitest";
import { fitGlobal } from "../../../server/analysis/fit/fitGlobal.ts";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { fitProfile } from "../../../server/analysis/fit/fitProfile.ts";
import { summarizeDecayLengths } from "../../../server/analysis/fit/summarizeDecayLengths.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython } from "../../helpers/python.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

describe("summarizeDecayLengths", () => {
  it("reports mean, SD (n − 1), median and SEM of per-embryo λ beside the global λ", async () => {
    // Source: numpy mean/std(ddof=1)/median as reference.
    const random = createRandom(55);
    const x = positions(0, 200, 50);
    const profiles = [45, 52, 38, 60, 49, 41].map((l, k) => ({ x, y: simulateProfile("exponential", x, [l], 80 + 10 * k, 6, { noiseSd: 1, random }) }));
    const options = FitOptions.parse({});
    const fits = profiles.map((p) => fitProfile(p.x, p.y, options));
    fits.push(fitProfile([0, 1, 2], [1, 1, 1], options));
    const global = fitGlobal(profiles, options);
    const summary = summarizeDecayLengths(fits, global);
    const values = fits.flatMap((f) => (f.ok ? [f.parameters.lambdaUm.value] : []));
    const ref = await runPython<number[]>("v = np.array(data); result = [v.mean(), v.std(ddof=1), np.median(v)]", values);
    expect(summary.fitted).toBe(6);
    expect(summary.failed).toBe(1);
    expect(summary.meanUm!).toBeCloseTo(ref[0], 10);
    expect(summary.sdUm!).toBeCloseTo(ref[1], 10);
    expect(summary.medianUm!).toBeCloseTo(ref[2], 10);
    expect(summary.semUm!).toBeCloseTo(ref[1] / Math.sqrt(6), 10);
    if (!global.ok) throw new Error(global.message);
    expect(summary.global).toEqual(global.shared.lambdaUm);
    expect(summary.meanOverGlobal!).toBeCloseTo(ref[0] / global.shared.lambdaUm.value, 10);
    // True λ differ by ±20% between embryos, far beyond the noise: the note says so.
    expect(summary.note).toMatch(/likely varies between embryos/);
  });
});
