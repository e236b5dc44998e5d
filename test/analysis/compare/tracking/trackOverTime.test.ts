import { describe, expect, it } from "vitest";
import { trackOverTime } from "../../../../server/analysis/compare/tracking/trackOverTime.ts";
import type { EmbryoRecord } from "../../../../server/analysis/compare/embryoRecord.ts";
import { createRandom } from "../../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../../helpers/python.ts";

const rng = createRandom(77);
const records: EmbryoRecord[] = [];
for (let i = 0; i < 48; i++) {
  const ageS = 1200 + 150 * i;
  records.push({ embryo: `wt-${i}`, group: "wt", ageS, lambdaUm: 100 - 55 * Math.exp(-ageS / 2000) + 3 * rng.normal(), converged: true });
}
records.push({ embryo: "wt-noage", group: "wt", lambdaUm: 90, converged: true });
records.push({ embryo: "wt-unconverged", group: "wt", ageS: 4000, lambdaUm: 90, converged: false });
for (let i = 0; i < 12; i++) records.push({ embryo: `st-${i}`, group: "staged", stage: ["cycle 13", "cycle 14", "cycle 9"][i % 3], lambdaUm: 80 + i, converged: true });
const wt = records.filter((r) => r.group === "wt" && r.converged && r.ageS !== undefined);

// Source: numpy means per half-open bin and scipy.stats.linregress on the same points.
const ref = await runPython<{ means: number[]; counts: number[]; slope: number; se: number }>(
  `
from scipy import stats
t, y = np.array(data["t"]), np.array(data["y"])
edges = np.linspace(t.min(), t.max(), 7)
idx = np.clip(np.searchsorted(edges, t, side="right") - 1, 0, 5)
r = stats.linregress(t, y)
result = {"means": [float(y[idx == k].mean()) for k in range(6)], "counts": [int((idx == k).sum()) for k in range(6)],
          "slope": r.slope, "se": r.stderr}
`,
  { t: wt.map((r) => r.ageS), y: wt.map((r) => r.lambdaUm) },
);

describe("trackOverTime", () => {
  const result = trackOverTime(records, { bootstrap: 400 });
  const series = result.series.find((s) => s.group === "wt")!;

  it("trackOverTime bins λ by age in equal-width bins with the same counts and means as numpy", () => {
    expect(series.numeric).toBe(true);
    expect(series.bins.map((b) => b.summary?.n ?? 0)).toEqual(ref.counts);
    series.bins.forEach((b, k) => expect(relativeDifference(b.summary!.mean, ref.means[k])).toBeLessThan(1e-12));
    expect(series.bins.at(-1)!.label.endsWith("]")).toBe(true);
  });

  it("trackOverTime's linear trend over the points matches scipy.stats.linregress", () => {
    expect(series.trend!.kind).toBe("linear");
    const trend = series.trend as Extract<typeof series.trend, { kind: "linear" }>;
    expect(relativeDifference(trend.slope.value, ref.slope)).toBeLessThan(1e-10);
    expect(relativeDifference(trend.slope.se!, ref.se)).toBeLessThan(1e-10);
  });

  it("trackOverTime fits a saturating trend that recovers τ and calls a formed gradient steady", () => {
    // Source: the data rise as 100 − 55·e^(−t/2000) over 1200–8250 s; at the last time
    // 55·e^(−4.1)/100 ≈ 0.9% of the plateau remains, below the 5% tolerance.
    const s = trackOverTime(records, { trend: "saturating", bootstrap: 200 }).series.find((x) => x.group === "wt")!;
    expect(s.trend!.kind).toBe("saturating");
    const fit = s.trend as Extract<typeof s.trend, { kind: "saturating" }>;
    expect(fit.converged).toBe(true);
    expect(fit.tau!.ci95![0]).toBeLessThan(2000);
    expect(fit.tau!.ci95![1]).toBeGreaterThan(2000);
    expect(s.steadyState!.notAtSteadyState).toBe(false);
    expect(s.steadyState!.rule).toMatch(/not at steady state when/);
  });

  it("trackOverTime flags a gradient still forming at the end of the observed ages", () => {
    // Source: with τ = 5000 s the same span ends 55·e^(−1.65)/100 ≈ 10.6% below the plateau,
    // and λ rises by ≈ 6 µm over the last third — still changing.
    const r = createRandom(78);
    const forming: EmbryoRecord[] = Array.from({ length: 48 }, (_, i) => {
      const ageS = 1200 + 150 * i;
      return { embryo: `f-${i}`, group: "forming", ageS, lambdaUm: 100 - 55 * Math.exp(-ageS / 5000) + 3 * r.normal(), converged: true };
    });
    const s = trackOverTime(forming, { trend: "saturating", bootstrap: 200 }).series[0];
    expect(s.steadyState!.notAtSteadyState).toBe(true);
    expect(s.steadyState!.reasons.length).toBeGreaterThanOrEqual(1);
  });

  it("trackOverTime treats stage labels as ordered categories without a trend", () => {
    const staged = trackOverTime(records, { time: "stage", bootstrap: 200 }).series.find((s) => s.group === "staged")!;
    expect(staged.numeric).toBe(false);
    expect(staged.bins.map((b) => b.label)).toEqual(["cycle 9", "cycle 13", "cycle 14"]);
    expect(staged.trend).toBeNull();
  });

  it("trackOverTime lists embryos without a time or a converged fit", () => {
    const reasons = Object.fromEntries(result.excluded.map((e) => [e.embryo, e.reason]));
    expect(reasons["wt-noage"]).toBe("no age");
    expect(reasons["wt-unconverged"]).toBe("profile fit did not converge");
    expect(reasons["st-0"]).toBe("no age");
  });
});
