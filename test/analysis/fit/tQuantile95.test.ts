import { describe, expect, it } from "vitest";
import { tQuantile95 } from "../../../server/analysis/fit/tQuantile95.ts";
import { runPython } from "../../helpers/python.ts";

describe("tQuantile95", () => {
  it("matches scipy.stats.t.ppf(0.975, df), also when asked twice", async () => {
    // Source: scipy.stats.t.ppf as reference.
    const dfs = [1, 2, 5, 57, 497, 10_000];
    const ref = await runPython<number[]>("from scipy import stats\nresult = [float(stats.t.ppf(0.975, d)) for d in data]", dfs);
    dfs.forEach((df, i) => {
      expect(Math.abs(tQuantile95(df) - ref[i])).toBeLessThan(1e-10 * ref[i]);
      expect(tQuantile95(df)).toBe(tQuantile95(df));
    });
  });
});
