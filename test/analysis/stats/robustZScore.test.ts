import { describe, expect, it } from "vitest";
import { robustZScores } from "../../../server/analysis/stats/robustZScore.ts";
import { runPython } from "../../helpers/python.ts";

describe("robustZScores", () => {
  it("robustZScores match (v − median)/scipy.stats.median_abs_deviation(scale='normal')", async () => {
    const v = [3.1, 2.9, 3.3, 3.0, 2.7, 3.2, 9.5, 3.05];
    // Source: scipy.stats.median_abs_deviation with scale="normal" as reference.
    const ref = await runPython<number[]>(
      `from scipy import stats\nv = np.array(data)\nresult = ((v - np.median(v)) / stats.median_abs_deviation(v, scale="normal")).tolist()`,
      v,
    );
    robustZScores(v).scores!.forEach((z, i) => expect(z).toBeCloseTo(ref[i], 6));
  });
  it("robustZScores returns null scores when more than half the values are equal", () => {
    // common practice, no source: a zero MAD gives no scale to judge by.
    expect(robustZScores([1, 1, 1, 5]).scores).toBeNull();
  });
});
