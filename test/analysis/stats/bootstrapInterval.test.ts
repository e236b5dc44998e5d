import { describe, expect, it } from "vitest";
import { bootstrapInterval, type SampleStatistic } from "../../../server/analysis/stats/bootstrapInterval.ts";
import { mean, standardDeviation } from "../../../server/analysis/stats/descriptive.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython } from "../../helpers/python.ts";

const gen = createRandom(2024);
// Skewed data (log-normal), where BCa and percentile intervals differ visibly.
const skewed = Array.from({ length: 30 }, () => Math.exp(3 + 0.5 * gen.normal()));
const groupA = Array.from({ length: 18 }, () => 40 * Math.exp(0.2 * gen.normal()));
const groupB = Array.from({ length: 14 }, () => 55 * Math.exp(0.25 * gen.normal()));
const B = 20000;

// Source: scipy.stats.bootstrap (method='BCa' and 'percentile') as reference on the same data.
const reference = await runPython<Record<string, [number, number]>>(
  `
import numpy as np
from scipy import stats
rng = np.random.default_rng(17)
def ci(samples, stat, method):
    r = stats.bootstrap(samples, stat, n_resamples=${B}, method=method, vectorized=True, rng=rng)
    return [float(r.confidence_interval.low), float(r.confidence_interval.high)]
m = lambda x, axis: np.mean(x, axis=axis)
ratio = lambda x, y, axis: np.mean(x, axis=axis) / np.mean(y, axis=axis)
sdratio = lambda x, y, axis: np.std(x, ddof=1, axis=axis) / np.std(y, ddof=1, axis=axis)
s = (np.array(data["s"]),)
ab = (np.array(data["a"]), np.array(data["b"]))
result = {"meanBca": ci(s, m, "BCa"), "meanPct": ci(s, m, "percentile"),
          "ratioBca": ci(ab, ratio, "BCa"), "ratioPct": ci(ab, ratio, "percentile"),
          "sdRatioBca": ci(ab, sdratio, "BCa")}
`,
  { s: skewed, a: groupA, b: groupB },
);

const meanStat: SampleStatistic = ([x]) => mean(x);
const ratioStat: SampleStatistic = ([x, y]) => mean(x) / mean(y);
const sdRatioStat: SampleStatistic = ([x, y]) => standardDeviation(x) / standardDeviation(y);

/**
 * Monte-Carlo tolerance for an interval endpoint. The 2.5% quantile of B
 * replicates has SD ≈ √(α(1−α)/B)/f(q); for a near-normal bootstrap
 * distribution with SD s, f(q) = φ(1.96)/s ≈ 0.058/s, giving ≈ 0.019·s at
 * B = 20,000. Two independent runs differ by ≈ 0.027·s; we allow 5 such SDs
 * (0.14·s) to cover the heavier tail of skewed data. Source: asymptotic SD of a
 * sample quantile (Cramér 1946, Mathematical Methods of Statistics, §28.5).
 */
const tolerance = (se: number) => 0.14 * se;

describe("bootstrapInterval", () => {
  it("bootstrapInterval BCa and percentile intervals of a mean agree with scipy.stats.bootstrap within Monte-Carlo error", () => {
    const bca = bootstrapInterval([skewed], meanStat, { resamples: B, level: 0.95, method: "bca", random: createRandom(1) });
    const pct = bootstrapInterval([skewed], meanStat, { resamples: B, level: 0.95, method: "percentile", random: createRandom(2) });
    for (let k = 0; k < 2; k++) {
      expect(Math.abs(bca.interval![k] - reference.meanBca[k])).toBeLessThan(tolerance(bca.se!));
      expect(Math.abs(pct.interval![k] - reference.meanPct[k])).toBeLessThan(tolerance(pct.se!));
    }
    // Right-skewed data: BCa shifts the interval up relative to the percentile interval
    // (Efron & Tibshirani 1993, ch. 14); scipy shows the same shift.
    expect(reference.meanBca[1]).toBeGreaterThan(reference.meanPct[1]);
    expect(bca.interval![1]).toBeGreaterThan(pct.interval![1]);
  });

  it("bootstrapInterval resamples two groups independently and matches scipy for a ratio of means and of SDs", () => {
    const bca = bootstrapInterval([groupA, groupB], ratioStat, { resamples: B, level: 0.95, method: "bca", random: createRandom(3) });
    const pct = bootstrapInterval([groupA, groupB], ratioStat, { resamples: B, level: 0.95, method: "percentile", random: createRandom(4) });
    const sd = bootstrapInterval([groupA, groupB], sdRatioStat, { resamples: B, level: 0.95, method: "bca", random: createRandom(5) });
    for (let k = 0; k < 2; k++) {
      expect(Math.abs(bca.interval![k] - reference.ratioBca[k])).toBeLessThan(tolerance(bca.se!));
      expect(Math.abs(pct.interval![k] - reference.ratioPct[k])).toBeLessThan(tolerance(pct.se!));
      expect(Math.abs(sd.interval![k] - reference.sdRatioBca[k])).toBeLessThan(tolerance(sd.se!));
    }
  });

  it("bootstrapInterval reports a degenerate BCa interval as data, not NaN", () => {
    // common practice, no source: constant data give every replicate equal to the estimate.
    const r = bootstrapInterval([[5, 5, 5, 5]], meanStat, { resamples: 200, level: 0.95, method: "bca", random: createRandom(9) });
    expect(r.value).toBe(5);
    expect(r.interval === null || (r.interval[0] === 5 && r.interval[1] === 5)).toBe(true);
  });

  it("bootstrapInterval is reproducible from its seed and records it", () => {
    const opts = { resamples: 300, level: 0.9, method: "percentile" as const };
    const r1 = bootstrapInterval([groupA], meanStat, { ...opts, random: createRandom(77) });
    const r2 = bootstrapInterval([groupA], meanStat, { ...opts, random: createRandom(77) });
    expect(r1.interval).toEqual(r2.interval);
    expect(r1.seed).toBe(77);
  });
});
