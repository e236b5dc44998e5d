import { describe, expect, it } from "vitest";
import { compareGroups } from "../../../server/analysis/compare/compareGroups.ts";
import type { EmbryoRecord } from "../../../server/analysis/compare/embryoRecord.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";
import { syntheticEmbryos } from "./syntheticEmbryos.ts";

const base = syntheticEmbryos([
  { group: "wt", n: 14, lambdaUm: 95, cv: 0.12, amplitude: 800, background: 100, boundaryUm: 210, boundarySdUm: 6 },
  { group: "mutA", n: 11, lambdaUm: 80, cv: 0.15, amplitude: 650, background: 100, boundaryUm: 190, boundarySdUm: 9 },
  { group: "mutB", n: 12, lambdaUm: 92, cv: 0.1, amplitude: 820, background: 90, boundaryUm: 205, boundarySdUm: 5 },
], createRandom(314));
const records: EmbryoRecord[] = [
  ...base,
  { embryo: "wt-bad", group: "wt", lambdaUm: 300, converged: false },
  { embryo: "mutA-curated", group: "mutA", lambdaUm: 60, converged: true, status: "Excluded" },
  { embryo: "mutB-nan", group: "mutB", lambdaUm: Number.NaN, converged: true },
  { embryo: "no-group", group: "", lambdaUm: 90, converged: true },
  { ...base[0], lambdaUm: 1 },
];
const values = (g: string) => base.filter((r) => r.group === g).map((r) => r.lambdaUm);

// Source: numpy/scipy as reference — np.mean, np.std(ddof=1), scipy.stats.sem, np.median,
// scipy.stats.ttest_ind(equal_var=False), and scipy.stats.permutation_test on |mean difference|.
const reference = await runPython<{
  summary: Record<string, { mean: number; sd: number; sem: number; median: number }>;
  welch: Record<string, number>;
  perm: Record<string, number>;
}>(
  `
import numpy as np
from scipy import stats
g = {k: np.array(v) for k, v in data.items()}
stat = lambda x, y, axis: np.abs(np.mean(x, axis=axis) - np.mean(y, axis=axis))
pairs = [("mutA", "mutB"), ("mutA", "wt"), ("mutB", "wt")]
result = {
  "summary": {k: {"mean": float(np.mean(v)), "sd": float(np.std(v, ddof=1)), "sem": float(stats.sem(v)), "median": float(np.median(v))} for k, v in g.items()},
  "welch": {a + ":" + b: float(stats.ttest_ind(g[a], g[b], equal_var=False).pvalue) for a, b in pairs},
  "perm": {a + ":" + b: float(stats.permutation_test((g[a], g[b]), stat, vectorized=True, n_resamples=20000,
      alternative="greater", rng=np.random.default_rng(1)).pvalue) for a, b in pairs},
}
`,
  { wt: values("wt"), mutA: values("mutA"), mutB: values("mutB") },
);

const result = compareGroups(records, { seed: 7 });

describe("compareGroups", () => {
  it("compareGroups summarizes λ per group like numpy and scipy.stats.sem, from converged embryos only", () => {
    expect(result.groups.map((g) => g.name)).toEqual(["mutA", "mutB", "wt"]);
    for (const g of result.groups) {
      const ref = reference.summary[g.name];
      expect(g.lambda_um!.n).toBe(values(g.name).length);
      expect(relativeDifference(g.lambda_um!.mean, ref.mean)).toBeLessThan(1e-12);
      expect(relativeDifference(g.lambda_um!.sd!, ref.sd)).toBeLessThan(1e-12);
      expect(relativeDifference(g.lambda_um!.sem!, ref.sem)).toBeLessThan(1e-12);
      expect(relativeDifference(g.lambda_um!.median, ref.median)).toBeLessThan(1e-12);
      const [lo, hi] = g.lambda_um!.ci95!;
      expect(lo).toBeLessThan(ref.mean);
      expect(hi).toBeGreaterThan(ref.mean);
    }
  });

  it("compareGroups lists every excluded embryo with its reason", () => {
    // common practice, no source: unconverged fits, curated-out embryos and invalid λ are not measurements.
    const reasons = Object.fromEntries(result.groups.flatMap((g) => g.excluded.map((e) => [e.embryo, e.reason])));
    expect(reasons["wt-bad"]).toMatch(/did not converge/);
    expect(reasons["mutA-curated"]).toMatch(/status "Excluded" is excluded/);
    expect(reasons["mutB-nan"]).toMatch(/not a positive finite number \(got NaN\)/);
    expect(reasons["wt-1"]).toMatch(/repeated embryo label/);
    expect(result.excluded).toEqual([{ embryo: "no-group", reason: 'no value for the grouping field "group"' }]);
  });

  it("compareGroups gives Welch p equal to scipy and permutation p (default 10,000) within Monte-Carlo error", () => {
    expect(result.settings.permutations).toBe(10000);
    expect(result.contrasts).toHaveLength(3);
    for (const c of result.contrasts) {
      const key = `${c.a}:${c.b}`;
      expect(relativeDifference(c.p_welch!, reference.welch[key])).toBeLessThan(1e-10);
      const p = reference.perm[key];
      expect(Math.abs(c.p_permutation! - p)).toBeLessThan(4 * Math.sqrt(Math.max(p * (1 - p), 1e-4) * (1 / 10000 + 1 / 20000)) + 2e-4);
      expect(c.difference!.value).toBeCloseTo(reference.summary[c.a].mean - reference.summary[c.b].mean, 10);
      expect(c.ratio!.value).toBeCloseTo(reference.summary[c.a].mean / reference.summary[c.b].mean, 12);
    }
  });

  it("compareGroups applies Holm's step-down adjustment to Welch's p (the test its intervals invert) across the family of contrasts", () => {
    // Source: Holm 1979, Scand J Stat — p̃(i) = max_{j≤i} min(1, (m − j + 1) p(j)), computed here by hand.
    const raw = result.contrasts.map((c) => c.p_welch!);
    const order = raw.map((p, i) => [p, i] as const).sort((x, y) => x[0] - y[0]);
    let running = 0;
    const expected: number[] = [];
    order.forEach(([p, i], rank) => {
      running = Math.max(running, Math.min(1, (raw.length - rank) * p));
      expected[i] = running;
    });
    result.contrasts.forEach((c, i) => expect(c.p_holm).toBeCloseTo(expected[i], 14));
  });

  it("compareGroups against a reference compares each other group to it, a − b with a the other group", () => {
    const r = compareGroups(records, { reference: "wt", permutations: 999, bootstrap: 500 });
    expect(r.contrasts.map((c) => [c.a, c.b])).toEqual([["mutA", "wt"], ["mutB", "wt"]]);
    expect(Math.sign(r.contrasts[0].difference!.value)).toBe(Math.sign(reference.summary.mutA.mean - reference.summary.wt.mean));
    expect(Math.sign(r.contrasts[0].effect_size!.value)).toBe(Math.sign(r.contrasts[0].difference!.value));
    expect(() => compareGroups(records, { reference: "wildtype" })).toThrow(/reference group "wildtype" not found; groups are "mutA", "mutB", "wt"/);
  });

  it("compareGroups reports amplitude, background-corrected amplitude and boundary spread per group", () => {
    const wt = result.groups.find((g) => g.name === "wt")!;
    const rows = base.filter((r) => r.group === "wt");
    // common practice, no source: corrected amplitude is amplitude − background per embryo.
    const corrected = rows.map((r) => r.amplitude! - r.background!);
    expect(wt.amplitude_corrected_au!.mean).toBeCloseTo(corrected.reduce((s, v) => s + v, 0) / corrected.length, 9);
    expect(wt.boundary_sd_um!.source).toBe("embryos");
    expect(wt.boundary_sd_um!.ci95![0]).toBeLessThan(wt.boundary_sd_um!.value);
    expect(result.spread).toHaveLength(3);
    expect(result.spread[0].boundary_sd!.ratio.value).toBeCloseTo(
      result.groups[0].boundary_sd_um!.value / result.groups[1].boundary_sd_um!.value, 12);
  });

  it("compareGroups compares σ_x from supplied estimates when metric is sigma_x, with Holm on p_spread", () => {
    const r = compareGroups(records, {
      metric: "sigma_x", reference: "wt", bootstrap: 500,
      extras: {
        wt: { sigmaXMinUm: { value: 6, se: 0.6, ci95: null } },
        mutA: { sigmaXMinUm: { value: 9, se: 0.9, ci95: null } },
        mutB: { sigmaXMinUm: { value: 6.2, se: 0.5, ci95: null } },
      },
    });
    const c = r.contrasts[0];
    expect(c.source).toBe("supplied_sigma_x");
    // Source: delta method on the log scale (e.g. Casella & Berger 2002, Statistical Inference, §5.5.4):
    // SE(ln r) = √(0.1² + 0.1²), CI = 1.5·exp(±1.96·SE).
    const se = Math.hypot(0.1, 0.1);
    expect(c.ratio!.value).toBeCloseTo(1.5, 12);
    expect(c.ratio!.ci95![0]).toBeCloseTo(1.5 * Math.exp(-1.959964 * se), 5);
    expect(c.p_welch).toBeNull();
    expect(c.p_holm).not.toBeNull();
    expect(r.groups.find((g) => g.name === "wt")!.sigma_x_min_um!.value).toBe(6);
  });

  it("compareGroups groups by any field, with windows for numeric ones", () => {
    const timed = base.map((r, i) => ({ ...r, ageS: 3000 + (i % 3) * 700, metadata: { session: i % 2 ? "s2" : "s1" } }));
    const byAge = compareGroups(timed, { by: "ageS", window: 1000, permutations: 99, bootstrap: 200 });
    expect(byAge.groups.map((g) => g.name)).toEqual(["[3000, 4000)", "[4000, 5000)"]);
    const bySession = compareGroups(timed, { by: "session", permutations: 99, bootstrap: 200 });
    expect(bySession.groups.map((g) => g.n)).toEqual([Math.ceil(base.length / 2), Math.floor(base.length / 2)]);
  });

  it("compareGroups reports progress up to 1 and is reproducible from its seed", () => {
    const seen: [number, string][] = [];
    const r1 = compareGroups(base, { permutations: 199, bootstrap: 300, seed: 5, progress: (f, s) => seen.push([f, s]) });
    const r2 = compareGroups(base, { permutations: 199, bootstrap: 300, seed: 5 });
    expect(seen.at(-1)![0]).toBeCloseTo(1, 12);
    expect(seen.every(([f], i) => i === 0 || f >= seen[i - 1][0])).toBe(true);
    expect(new Set(seen.map(([, s]) => s))).toEqual(new Set(["summaries", "contrasts", "spread"]));
    expect(r1.contrasts).toEqual(r2.contrasts);
    expect(r1.settings.seed).toBe(5);
    expect("progress" in r1.settings).toBe(false);
  });
});
