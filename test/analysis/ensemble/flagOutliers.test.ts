import { describe, expect, it } from "vitest";
import { flagOutliers } from "../../../server/analysis/ensemble/flagOutliers.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";

describe("flagOutliers", () => {
  const random = createRandom(101);
  const embryos = Array.from({ length: 30 }, (_, i) => `e${i}`);
  const lambda = embryos.map(() => 80 + 4 * random.normal());
  lambda[12] = 130;

  it("finds a planted outlier by its robust z-score and keeps every embryo in the report", () => {
    // Source: Iglewicz & Hoaglin 1993 — |modified z| > 3.5 marks a potential outlier.
    const r = flagOutliers(embryos, { lambdaUm: lambda });
    expect(r.flagged.map((f) => f.embryo)).toEqual(["e12"]);
    expect(r.flagged[0].z).toBeGreaterThan(3.5);
    expect(r.metrics[0].scores).toHaveLength(30);
  });

  it("scores multiplicative metrics on the log scale and residuals on their upper side only", () => {
    // common practice, no source: a small residual is never suspicious.
    const residual = embryos.map(() => Math.exp(0.2 * random.normal()));
    residual[3] = 0.01;
    residual[20] = 6;
    const r = flagOutliers(embryos, { residualRms: residual }, 3.5, { logScale: ["residualRms"], upperOnly: ["residualRms"] });
    expect(r.flagged.map((f) => f.embryo)).toEqual(["e20"]);
    expect(r.metrics[0].scale).toBe("log");
  });

  it("skips a metric with too few values or no spread and says why", () => {
    // common practice, no source.
    const r = flagOutliers(["a", "b", "c", "d"], { few: [1, null, null, 2], same: [5, 5, 5, 9] });
    expect(r.skipped).toEqual([
      { metric: "few", reason: "only 2 embryos have a value; at least 3 are needed" },
      { metric: "same", reason: "more than half the embryos share one value (MAD is zero)" },
    ]);
  });
});
