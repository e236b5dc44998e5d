import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listFitItems } from "../../db/fits.ts";
import type { ScalingResult } from "../../server/analysis/compare/tracking/sizeScaling.ts";
import { TrackRequest } from "../../server/services/groups/trackRequest.ts";
import { prepareTracking, storeTracking } from "../../server/services/groups/trackService.ts";
import { runTrackTask } from "../../server/services/groups/trackTask.ts";
import { runPython } from "../helpers/python.ts";
import { seedAnalyses } from "../helpers/seedAnalyses.ts";
import { startTestServer, type TestServer } from "../helpers/testServer.ts";

/** Parse CSV text with Python's csv module (an outside reader; RFC 4180) into header-keyed rows of strings. */
const readCsv = (text: string) => runPython<Record<string, string>[]>("import csv, io\nresult = list(csv.DictReader(io.StringIO(data, newline='')))", text);
const num = (v: string) => (v === "" ? null : Number(v));

describe("GET /api/exports/:table.csv", () => {
  let s: TestServer;
  let seeded: ReturnType<typeof seedAnalyses>;
  beforeAll(async () => {
    s = await startTestServer({ demo: true });
    seeded = seedAnalyses(s.db);
  });
  afterAll(async () => s.close());

  const csv = async (path: string) => {
    const res = await fetch(`${s.url}${path}`);
    expect(res.status, path).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    return { text: await res.text(), disposition: res.headers.get("content-disposition") };
  };

  it("fits.csv lists the newest fit of each profile with λ, SE and 95% CI in µm, as stored", async () => {
    const { text, disposition } = await csv("/api/exports/fits.csv?genotype=wt&channel=glm");
    expect(disposition).toBe('attachment; filename="fits_wt_glm.csv"');
    const rows = await readCsv(text);
    const stored = listFitItems(s.db, { genotype: "wt", channel: "glm" });
    expect(rows).toHaveLength(30);
    expect(Object.keys(rows[0])).toEqual(expect.arrayContaining(["embryo", "genotype", "channel", "model", "lambda_um", "lambda_se_um", "lambda_ci95_low_um", "lambda_ci95_high_um", "status", "aicc"]));
    rows.forEach((r, i) => {
      expect(r.embryo).toBe(stored[i].embryo);
      expect(num(r.lambda_um)).toBe(stored[i].lambdaUm!.value);
      expect(num(r.lambda_se_um)).toBe(stored[i].lambdaUm!.se);
      expect([num(r.lambda_ci95_low_um), num(r.lambda_ci95_high_um)]).toEqual(stored[i].lambdaUm!.ci95);
      expect(num(r.aicc)).toBe(stored[i].aicc);
      expect(r.status).toBe("converged");
    });
    // Python recomputes the CI half-width from the SE: it is t(0.975, n − 3)·SE (Source: least-squares CI, science.md §7; scipy.stats.t as reference).
    const ratios = await runPython<number[]>("from scipy import stats\nresult = [ (float(r['lambda_ci95_high_um']) - float(r['lambda_um'])) / (float(r['lambda_se_um']) * stats.t.ppf(0.975, int(r['n_points']) - 3)) for r in data ]", rows);
    for (const r of ratios) expect(r).toBeCloseTo(1, 8);
  });

  it("precision.csv holds σ_x with its CI and the mean ± SD profile, empty where σ_x is masked", async () => {
    const p = seeded.precisionGlm;
    const { text, disposition } = await csv(`/api/exports/precision.csv?analysis=${p.analysis_id}`);
    expect(disposition).toBe(`attachment; filename="precision_wt_glm_analysis${p.analysis_id}.csv"`);
    const rows = await readCsv(text);
    expect(Object.keys(rows[0])).toEqual(["position_um", "mean_intensity_au", "sd_intensity_au", "sigma_x_um", "sigma_x_ci95_low_um", "sigma_x_ci95_high_um"]);
    expect(rows.map((r) => num(r.position_um))).toEqual(p.x);
    expect(rows.map((r) => num(r.sigma_x_um))).toEqual(p.sigma_x);
    expect(rows.map((r) => (r.sigma_x_ci95_low_um === "" ? null : [num(r.sigma_x_ci95_low_um), num(r.sigma_x_ci95_high_um)]))).toEqual(p.sigma_x_ci95);
    expect(rows.map((r) => num(r.sd_intensity_au))).toEqual(p.sd_intensity);
  });

  it("precision.csv of another channel of a joint analysis is chosen with channel=", async () => {
    const rows = await readCsv((await csv(`/api/exports/precision.csv?analysis=${seeded.precisionJoint.analysis_id}&channel=vellin`)).text);
    expect(rows.map((r) => num(r.sigma_x_um))).toEqual(seeded.precisionJoint.per_channel[0].sigma_x);
  });

  it("comparison.csv holds each group's mean with its CI and each contrast with its p-values", async () => {
    const c = seeded.comparison;
    const rows = await readCsv((await csv(`/api/exports/comparison.csv?analysis=${c.analysis_id}`)).text);
    const groups = rows.filter((r) => r.section === "group");
    const contrasts = rows.filter((r) => r.section === "contrast");
    expect(groups.map((r) => r.group)).toEqual(c.groups.map((g) => g.name));
    expect(groups.map((r) => num(r.estimate))).toEqual(c.groups.map((g) => g.lambda_um!.mean));
    expect(groups.map((r) => [num(r.ci95_low), num(r.ci95_high)])).toEqual(c.groups.map((g) => g.lambda_um!.ci95));
    expect(groups.every((r) => r.unit === "µm")).toBe(true);
    expect(contrasts.map((r) => [r.group, r.versus])).toEqual(c.contrasts.map((k) => [k.a, k.b]));
    expect(contrasts.map((r) => num(r.p_holm))).toEqual(c.contrasts.map((k) => k.p_holm));
    // Holm's step-down adjustment of Welch's p (the default family), recomputed in numpy (Source: Holm 1979, Scand J Stat).
    const holm = await runPython<number[]>(
      "p = np.array([float(r['p_welch']) for r in data]); o = np.argsort(p); m = len(p)\nadj = np.maximum.accumulate((m - np.arange(m)) * p[o]); adj = np.minimum(adj, 1)\nresult = np.empty(m); result[o] = adj\nresult = result.tolist()",
      contrasts,
    );
    holm.forEach((v, i) => expect(num(contrasts[i].p_holm)!).toBeCloseTo(v, 12));
  });

  it("tracking.csv of a dosage series lists each embryo's boundary, whose OLS slope on ln(dosage) is λ from the shift", async () => {
    const t = seeded.tracking;
    const rows = await readCsv((await csv(`/api/exports/tracking.csv?analysis=${t.analysis_id}`)).text);
    expect(Object.keys(rows[0])).toEqual(["group", "embryo", "dosage", "ln_dosage", "boundary_um", "no_crossing", "boundary_limit_um"]);
    expect(rows).toHaveLength((t.result as { n: number }).n);
    // Source: x_b = λ·ln(A·f/θ), so the slope of x_b on ln f is λ (Driever & Nüsslein-Volhard 1988, Cell); numpy.polyfit is the reference fit.
    const slope = await runPython<number>("x = np.log([float(r['dosage']) for r in data]); y = [float(r['boundary_um']) for r in data]\nresult = float(np.polyfit(x, y, 1)[0])", rows);
    expect(slope).toBeCloseTo((t.result as { lambda_from_shift_um: { value: number } }).lambda_from_shift_um.value, 8);
  });

  it("tracking.csv over length lists each embryo's length and λ, whose log–log OLS slope is the reported scaling exponent", async () => {
    const prepared = prepareTracking(s.db, TrackRequest.parse({ over: "length", channel: "glm", selection: { genotypes: ["wt", "tardy"] } }));
    const t = storeTracking(s.db, prepared, runTrackTask(prepared.task));
    const rows = await readCsv((await csv(`/api/exports/tracking.csv?analysis=${t.analysis_id}`)).text);
    expect(Object.keys(rows[0])).toEqual(["group", "embryo", "length_um", "lambda_um", "boundary_um"]);
    // Source: λ ∝ L^β, so β is the slope of ln λ on ln L; numpy.polyfit is the reference fit.
    const slopes = await runPython<Record<string, number>>(
      "groups = sorted(set(r['group'] for r in data))\nresult = {g: float(np.polyfit(np.log([float(r['length_um']) for r in data if r['group'] == g]), np.log([float(r['lambda_um']) for r in data if r['group'] == g]), 1)[0]) for g in groups}",
      rows,
    );
    const groups = (t.result as ScalingResult).groups;
    expect(Object.keys(slopes).sort()).toEqual(groups.map((g) => g.group).sort());
    for (const g of groups) expect(slopes[g.group]).toBeCloseTo(g.lambda!.slope.value, 8);
  });

  it("plan.csv is the power table of the plan, named by its tests", async () => {
    const p = seeded.plan;
    const rows = await readCsv((await csv(`/api/exports/plan.csv?analysis=${p.analysis_id}`)).text);
    expect(Object.keys(rows[0])).toEqual(["n_per_group", "power_exact_pooled_t", "power_normal_approximation", "power_simulated_welch_t", "power_simulated_permutation"]);
    expect(rows.map((r) => [num(r.n_per_group), num(r.power_exact_pooled_t), num(r.power_simulated_welch_t), num(r.power_simulated_permutation)])).toEqual(
      p.table.map((r) => [r.n, r.power_analytic, r.power_simulated, r.power_permutation_simulated]),
    );
    // The exact power of the pooled t-test from the noncentral t (Cohen 1988, ch. 2); scipy.stats.nct is the reference.
    const exact = await runPython<number[]>(
      "from scipy import stats\nd = data['d']\nresult = [float(1 - stats.nct.cdf(stats.t.ppf(0.975, 2*n - 2), 2*n - 2, d*np.sqrt(n/2)) + stats.nct.cdf(-stats.t.ppf(0.975, 2*n - 2), 2*n - 2, d*np.sqrt(n/2))) for n in data['n']]",
      { d: p.standardized_effect, n: rows.map((r) => num(r.n_per_group)) },
    );
    exact.forEach((v, i) => expect(num(rows[i].power_exact_pooled_t)!).toBeCloseTo(v, 6));
  });

  it("unknown tables and analyses, a missing analysis and an analysis of the wrong kind are 4xx", async () => {
    const status = async (path: string) => (await fetch(`${s.url}${path}`)).status;
    expect(await status("/api/exports/everything.csv")).toBe(400);
    expect(await status("/api/exports/plan.csv")).toBe(400);
    expect(await status("/api/exports/plan.csv?analysis=999999")).toBe(404);
    expect(await status(`/api/exports/plan.csv?analysis=${seeded.comparison.analysis_id}`)).toBe(400);
    expect(await status(`/api/exports/precision.csv?analysis=${seeded.precisionGlm.analysis_id}&channel=nope`)).toBe(404);
  });
});
