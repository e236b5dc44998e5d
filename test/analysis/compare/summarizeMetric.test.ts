import { describe, expect, it } from "vitest";
import { summarizeMetric } from "../../../server/analysis/compare/summarizeMetric.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

const gen = createRandom(12);
const lambdas = Array.from({ length: 16 }, () => 90 * Math.exp(0.2 * gen.normal()));
const B = 20000;
// Source: numpy (mean, std ddof=1, median), scipy.stats.sem, scipy.stats.variation(ddof=1) and
// scipy.stats.bootstrap(method='BCa') as reference on the same values.
const ref = await runPython<{ mean: number; sd: number; sem: number; median: number; cv: number; ci: [number, number] }>(
  `
from scipy import stats
x = np.array(data)
r = stats.bootstrap((x,), lambda v, axis: np.mean(v, axis=axis), n_resamples=${B}, method="BCa", vectorized=True, rng=np.random.default_rng(8))
result = {"mean": float(np.mean(x)), "sd": float(np.std(x, ddof=1)), "sem": float(stats.sem(x)), "median": float(np.median(x)),
          "cv": float(stats.variation(x, ddof=1)), "ci": [float(r.confidence_interval.low), float(r.confidence_interval.high)]}
`,
  lambdas,
);

describe("summarizeMetric", () => {
  it("summarizeMetric matches numpy/scipy descriptive statistics and scipy's BCa interval of the mean", () => {
    const s = summarizeMetric(lambdas, { bootstrap: B, level: 0.95, interval: "bca", random: createRandom(4) })!;
    expect(s.n).toBe(16);
    expect(relativeDifference(s.mean, ref.mean)).toBeLessThan(1e-12);
    expect(relativeDifference(s.sd!, ref.sd)).toBeLessThan(1e-12);
    expect(relativeDifference(s.sem!, ref.sem)).toBeLessThan(1e-12);
    expect(relativeDifference(s.median, ref.median)).toBeLessThan(1e-12);
    expect(relativeDifference(s.cv!, ref.cv)).toBeLessThan(1e-12);
    // Monte-Carlo tolerance 0.14·SEM, derived in test/analysis/stats/bootstrapInterval.test.ts.
    expect(Math.abs(s.ci95![0] - ref.ci[0])).toBeLessThan(0.14 * ref.sem);
    expect(Math.abs(s.ci95![1] - ref.ci[1])).toBeLessThan(0.14 * ref.sem);
  });

  it("summarizeMetric skips non-finite values, returns null for none and no interval below 3 embryos", () => {
    // common practice, no source: a CI from 1–2 embryos would be meaningless.
    const opts = { bootstrap: 200, level: 0.95, interval: "bca" as const, random: createRandom(1) };
    expect(summarizeMetric([], opts)).toBeNull();
    expect(summarizeMetric([Number.NaN], opts)).toBeNull();
    const two = summarizeMetric([10, 12, Number.NaN], opts)!;
    expect(two.n).toBe(2);
    expect(two.ci95).toBeNull();
    const one = summarizeMetric([10], opts)!;
    expect(one.sd).toBeNull();
    expect(one.sem).toBeNull();
  });
});
