import { describe, expect, it } from "vitest";
import { analysePrecision } from "../../../server/analysis/precision/analysePrecision.ts";
import { lengthScaling } from "../../../server/analysis/precision/lengthScaling.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython } from "../../helpers/python.ts";

describe("scaling with embryo length", () => {
  it("lengthScaling equals scipy.stats.linregress on log(value) against log(length)", async () => {
    const lengths = [480, 505, 520, 455, 530, 498, 470];
    const lambdas = [95, 99, 108, 88, 104, 101, 90];
    // Source: scipy.stats.linregress as reference.
    const ref = await runPython<{ slope: number; stderr: number; intercept: number }>(
      `
from scipy import stats
r = stats.linregress(np.log(data["L"]), np.log(data["v"]))
result = {"slope": r.slope, "stderr": r.stderr, "intercept": r.intercept}
`,
      { L: lengths, v: lambdas },
    );
    const fit = lengthScaling("lambdaUm", lengths, lambdas)!;
    expect(fit.exponent.value).toBeCloseTo(ref.slope, 12);
    expect(fit.exponent.se!).toBeCloseTo(ref.stderr, 12);
    expect(fit.logPrefactor.value).toBeCloseTo(ref.intercept, 11);
    expect(lengthScaling("lambdaUm", [1, 2], [3, 4])).toBeNull();
  });

  it("analysePrecision: a decay length proportional to embryo length gives an exponent whose CI contains 1, not 0; boundaries scale too", () => {
    // Source: common practice, no source — exponent 1 of value ∝ length^β means perfect scaling.
    const random = createRandom(61);
    const group = Array.from({ length: 60 }, (_, i) => {
      const lengthUm = 500 * (1 + 0.08 * random.normal());
      const lambdaUm = 0.2 * lengthUm * (1 + 0.02 * random.normal());
      const x = Array.from({ length: Math.floor(lengthUm / 2) + 1 }, (_, k) => 2 * k);
      return { embryo: `e${i}`, positionUm: x, intensity: x.map((v) => 1000 * Math.exp(-v / lambdaUm)), lengthUm, lambdaUm };
    });
    const summaries = Object.fromEntries(group.map((p) => [p.embryo, { lambdaUm: p.lambdaUm }]));
    const r = analysePrecision(group, {
      coords: "relative",
      embryoSummaries: summaries,
      bootstrap: { resamples: 50 },
      decoding: { enabled: false },
      information: { extrapolate: false },
      boundary: { atPosition: 0.4 },
    });
    const scaling = r.scaling!;
    const lambdaFit = scaling.regressions.find((f) => f.quantity === "lambdaUm")!;
    expect(lambdaFit.consistentWithScaling).toBe(true);
    expect(lambdaFit.consistentWithNoScaling).toBe(false);
    const boundaryFit = scaling.regressions.find((f) => f.quantity === "boundaryPositionUm")!;
    expect(boundaryFit.consistentWithScaling).toBe(true);
    // Scaling profiles are more precise in relative coordinates: the spread in µm comes from embryo size.
    expect(scaling.minimumUm.relative!).toBeLessThan(scaling.minimumUm.absolute!);
    expect(r.unit).toBe("fraction of length");
    expect(r.sigmaXSummary!.um!.value).toBeCloseTo(r.sigmaXSummary!.value * r.meanLengthUm!, 10);
  });
});
