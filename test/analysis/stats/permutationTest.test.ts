import { describe, expect, it } from "vitest";
import { permutationTest } from "../../../server/analysis/stats/permutationTest.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython } from "../../helpers/python.ts";

const gen = createRandom(7);
const a = Array.from({ length: 12 }, () => 50 + 6 * gen.normal());
const b = Array.from({ length: 15 }, () => 55 + 6 * gen.normal());
const small: [number[], number[]] = [[3.1, 4.2, 2.8, 5.0], [5.5, 6.1, 4.9, 7.2, 5.8]];

// Source: scipy.stats.permutation_test as reference. Our two-sided rule counts
// |d*| ≥ |d|, which is scipy's test of the statistic |mean(a) − mean(b)| with
// alternative='greater' (Monte-Carlo p = (b+1)/(m+1); exact enumeration for the small case).
const reference = await runPython<{ mc: number; exact: number }>(
  `
import numpy as np
from scipy import stats
stat = lambda x, y, axis: np.abs(np.mean(x, axis=axis) - np.mean(y, axis=axis))
mc = stats.permutation_test((np.array(data["a"]), np.array(data["b"])), stat, permutation_type="independent",
    vectorized=True, n_resamples=40000, alternative="greater", rng=np.random.default_rng(3))
ex = stats.permutation_test((np.array(data["s"][0]), np.array(data["s"][1])), stat, permutation_type="independent",
    vectorized=True, n_resamples=np.inf, alternative="greater")
result = {"mc": float(mc.pvalue), "exact": float(ex.pvalue)}
`,
  { a, b, s: small },
);

/** 4·(Monte-Carlo SD of the difference of two p estimates) for binomial counts. */
function mcTolerance(p: number, m1: number, m2: number): number {
  return 4 * Math.sqrt(p * (1 - p) * (1 / m1 + 1 / m2));
}

describe("permutationTest", () => {
  it("permutationTest with 10,000 permutations agrees with scipy.stats.permutation_test within Monte-Carlo error", () => {
    const r = permutationTest(a, b, { permutations: 10000, random: createRandom(11) });
    expect(reference.mc).toBeGreaterThan(0.005); // the check is informative only away from the floor 1/(m+1)
    expect(Math.abs(r.p - reference.mc)).toBeLessThan(mcTolerance(reference.mc, 10000, 40000));
    expect(r.p).toBe((r.exceedances + 1) / (r.permutations + 1));
    expect(r.seed).toBe(11);
  });

  it("permutationTest approaches scipy's exact enumeration on a small design (126 relabellings)", () => {
    const r = permutationTest(small[0], small[1], { permutations: 20000, random: createRandom(5) });
    expect(Math.abs(r.p - reference.exact)).toBeLessThan(mcTolerance(reference.exact, 20000, 1e12));
  });

  it("permutationTest keeps its size under the null: rejection rate at α = 0.05 within binomial error", () => {
    // Source: Phipson & Smyth 2010, Stat Appl Genet Mol Biol — (b+1)/(m+1) gives P(p ≤ α) ≤ α.
    const rng = createRandom(99);
    const reps = 600;
    let rejections = 0;
    for (let r = 0; r < reps; r++) {
      const x = Array.from({ length: 8 }, () => rng.normal());
      const y = Array.from({ length: 10 }, () => rng.normal());
      if (permutationTest(x, y, { permutations: 199, random: rng }).p <= 0.05) rejections++;
    }
    const rate = rejections / reps;
    const sd = Math.sqrt(0.05 * 0.95 / reps);
    expect(rate).toBeLessThan(0.05 + 3 * sd);
    expect(rate).toBeGreaterThan(0.05 - 3 * sd);
  });

  it("permutationTest is reproducible from its seed", () => {
    const r1 = permutationTest(a, b, { permutations: 500, random: createRandom(3) });
    const r2 = permutationTest(a, b, { permutations: 500, random: createRandom(3) });
    expect(r1.p).toBe(r2.p);
  });
});
