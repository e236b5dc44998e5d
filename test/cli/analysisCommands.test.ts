import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { SCENARIO } from "../../fixtures/demoScenario.ts";
import { normalQuantile } from "../../server/analysis/stats/normal.ts";
import { runCliInProcess } from "../helpers/runCliInProcess.ts";

// The demo data's generating values are stated in fixtures/README.md; these end-to-end
// checks confirm the commands recover them (Source: fixtures/demoScenario.ts, the generator).
const WT_LAMBDA = SCENARIO.genotypes[0].lambdaUm;
const TARDY_OVER_WT = Math.SQRT2; // degradation halved ⇒ λ = √(D/k) grows by √2 (METHODS.md §1)

describe("analysis commands on the demo database", () => {
  const dir = mkdtempSync(join(tmpdir(), "mg-an-"));
  const db = join(dir, "demo.db");
  const cli = async (...args: string[]) => {
    const r = await runCliInProcess([...args, "--db", db], {}, dir);
    if (r.code !== 0) throw new Error(`morphogauge ${args.join(" ")} exited ${r.code}: ${r.stderr}`);
    return r;
  };
  const json = async (...args: string[]) => JSON.parse((await cli(...args, "--json")).stdout);

  beforeAll(async () => {
    await cli("demo");
  });

  it("fit --model all --json gives one object per profile and model with λ, amplitude, background, AICc and status", async () => {
    const out = await json("fit", "--genotype", "wt", "--channel", "glm", "--model", "all", "--window", "30:");
    expect(out.fits).toHaveLength(30 * 5);
    for (const f of out.fits) {
      expect(Object.keys(f)).toEqual(expect.arrayContaining(["embryo", "genotype", "channel", "model", "lambda_um", "amplitude", "background", "aicc", "status"]));
      if (f.status === "converged" && f.lambda_um) {
        expect(f.lambda_um.ci95[0]).toBeLessThan(f.lambda_um.value);
        expect(f.lambda_um.ci95[1]).toBeGreaterThan(f.lambda_um.value);
      }
    }
    const weights = out.fits.filter((f: { embryo: string }) => f.embryo === "wt-01").map((f: { akaike_weight: number }) => f.akaike_weight);
    expect(weights.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 10);
    expect(out.caveat).toContain("λ = √(D/k)");
  });

  it("fit --json states each fit's window and error model, and per group the model AICc prefers, warning when it is not the fitted one", async () => {
    // Source: the demo profiles come from a localized source (fixtures/demoScenario.ts), so AICc should prefer
    // the source model over the exponential for most embryos; window and error-model names are the stable JSON contract.
    const out = await json("fit", "--genotype", "wt", "--channel", "glm");
    for (const f of out.fits) {
      expect(f.window).toMatchObject({ unit: "µm" });
      expect(f.window.from_um).toBeLessThan(f.window.to_um);
      expect(["data", "past-source-plateau", "past-source-dip"]).toContain(f.window.start);
      expect(f.error_model).toMatchObject({ covariance: "hc3", weights: "intensity" });
      expect(f.residual_check.verdict.length).toBeGreaterThan(0);
    }
    expect(out.groups).toHaveLength(1);
    const preference = out.groups[0].model_preference;
    expect(preference).toMatchObject({ model: "source", fitted_model: "exponential", agrees: false });
    expect(preference.summed_weight).toBeGreaterThan(15);
    expect(preference.profiles_compared).toBe(30);
    expect(out.groups[0].warning).toMatch(/AICc prefers the source model/);
    const text = (await cli("fit", "--genotype", "wt", "--channel", "glm")).stdout;
    expect(text).toContain("window (µm)");
    expect(text).toContain("Error model: HC3 sandwich");
    expect(text).toMatch(/WARNING: AICc prefers the source model/);
  });

  it("fit --window 0.1L:0.8L fits each embryo over its own 10–80% of length, and --error-model classic is stated", async () => {
    // common practice, no source: the window ends are fractions of each embryo's length L.
    const out = await json("fit", "--embryo", "wt-01", "--channel", "glm", "--window", "0.1L:0.8L", "--error-model", "classic");
    const f = out.fits[0];
    const listed = JSON.parse((await cli("list", "--json", "--genotype", "wt")).stdout).profiles.find((p: { embryo: string }) => p.embryo === "wt-01");
    const lengthUm = listed.length_um as number;
    expect(f.window).toMatchObject({ start: "given-fraction-of-length", end: "given-fraction-of-length" });
    expect(f.window.from_um).toBeGreaterThanOrEqual(0.1 * lengthUm);
    expect(f.window.to_um).toBeLessThanOrEqual(0.8 * lengthUm);
    expect(f.window.to_um).toBeGreaterThan(0.75 * lengthUm);
    expect(f.error_model.covariance).toBe("classic");
    const bad = await runCliInProcess(["fit", "--embryo", "wt-01", "--window", "0.5L:2L", "--db", db], {}, dir);
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/--window: "2L" must be a fraction of the length between 0L and 1L/);
  });

  it("fit --global recovers the wild-type decay length the demo was generated with", async () => {
    const out = await json("fit", "--genotype", "wt", "--channel", "glm", "--model", "finite", "--window", "30:", "--global");
    const g = out.global[0];
    expect(g).toMatchObject({ genotype: "wt", channel: "glm", model: "finite", n_embryos: 30 });
    // Per-embryo λ vary by 8% around the genotype value; the mean of 30 is within ~3% of it.
    expect(Math.abs(g.per_embryo.mean_um - WT_LAMBDA) / WT_LAMBDA).toBeLessThan(0.03);
    expect(Math.abs(g.lambda_um.value - WT_LAMBDA) / WT_LAMBDA).toBeLessThan(0.03);
  });

  it("refitting with the same options replaces the stored fits; other options add new ones", async () => {
    const count = async () => (await json("fit", "--genotype", "wt", "--channel", "glm", "--window", "30:")).fits.map((f: { fit_id: number }) => f.fit_id);
    const first = await count();
    const again = await count();
    expect(again).toEqual(first);
    const other = (await json("fit", "--genotype", "wt", "--channel", "glm", "--window", "40:")).fits.map((f: { fit_id: number }) => f.fit_id);
    expect(other.some((id: number) => first.includes(id))).toBe(false);
  });

  it("fit --diffusion adds k, half-life and source flux with delta-method errors", async () => {
    const out = await json("fit", "--embryo", "wt-01", "--channel", "glm", "--window", "30:", "--diffusion", "0.8±0.1");
    const d = out.fits[0].derived;
    const lambda = out.fits[0].lambda_um.value;
    // Source: k = D/λ² and t½ = ln2/k (METHODS.md §1).
    expect(d.degradationPerS.value).toBeCloseTo(0.8 / lambda ** 2, 12);
    expect(d.halfLifeS.value).toBeCloseTo(Math.LN2 / d.degradationPerS.value, 6);
    expect(d.degradationPerS.se).toBeGreaterThan(0);
  });

  it("precision --json returns σ_x with its band, the stated region, the headline σ_x, boundary spread and positional information under stable names", async () => {
    const out = await json("precision", "--genotype", "wt", "--channel", "glm", "--bootstrap", "200");
    expect(out).toMatchObject({ group: "wt", n_embryos: 30, coords: "absolute" });
    expect(out.x.length).toBe(out.sigma_x.length);
    expect(out.sigma_x_ci95.length).toBe(out.x.length);
    // common practice, no source: the default region is the covered span trimmed by 10% at each end.
    const span = out.settings.grid.range;
    expect(out.information_region).toMatchObject({ unit: "um", source: "default" });
    expect(out.information_region.from).toBeCloseTo(span[0] + 0.1 * (span[1] - span[0]), 9);
    expect(out.information_region.to).toBeCloseTo(span[1] - 0.1 * (span[1] - span[0]), 9);
    const s = out.sigma_x_summary;
    expect(s.method).toBe("geometric mean over the region");
    expect(s.ci95[0]).toBeLessThan(s.value);
    expect(s.ci95[1]).toBeGreaterThan(s.value);
    expect(Object.keys(out.boundary.positions)).toHaveLength(30);
    expect(out.boundary.sd).toBeGreaterThan(0);
    for (const key of ["small_noise", "direct_extrapolated"]) {
      const e = out.positional_information_bits[key];
      expect(e.value).toBeGreaterThan(0);
      expect(e.ci95[0]).toBeLessThan(e.value);
      expect(e.ci95[1]).toBeGreaterThan(e.value);
    }
    // Expected relative error of σ_x from n embryos: 1/√(2(n−1)). Source: Gregor et al. 2007, Cell.
    expect(out.sigma_x_expected_relative_error).toBeCloseTo(1 / Math.sqrt(58), 12);
  });

  it("precision over several genotypes uses one region for all of them and prints it; --region is kept exactly or refused", async () => {
    // common practice, no source: groups are compared only on one common, stated region.
    const out = await json("precision", "--genotype", "wt,tardy,glm-2x", "--channel", "glm", "--bootstrap", "20");
    const regions = out.results.map((r: { information_region: { from: number; to: number } }) => [r.information_region.from, r.information_region.to]);
    expect(new Set(regions.map(String)).size).toBe(1);
    const text = (await cli("precision", "--genotype", "wt,tardy", "--channel", "glm", "--bootstrap", "20", "--region", "60:300")).stdout;
    expect(text.match(/region 60–300 µm \(requested\)/g)).toHaveLength(2);
    expect(text).toContain("σ_x over the region =");
    expect(text).toContain("bits (direct, extrapolated to infinitely many embryos)");
    const beyond = await runCliInProcess(["precision", "--genotype", "wt", "--channel", "glm", "--region", "0:2000", "--db", db], {}, dir);
    expect(beyond.code).toBe(1);
    expect(beyond.stderr).toMatch(/region 0 to 2000 reaches beyond the grid/);
  });

  it("precision --derivative model fits the exponential inside --window and refits it in every resample", async () => {
    const out = await json("precision", "--genotype", "wt", "--channel", "glm", "--bootstrap", "20", "--derivative", "model", "--window", "60:300");
    expect(out.slope_model.window).toEqual([60, 300]);
    // Source: fixtures/demoScenario.ts — the demo's wild-type decay length.
    expect(Math.abs(out.slope_model.lambda - WT_LAMBDA) / WT_LAMBDA).toBeLessThan(0.15);
    expect(out.derivative).toContain("refitted in every bootstrap resample");
    const byDefault = await json("precision", "--genotype", "wt", "--channel", "glm", "--bootstrap", "20", "--derivative", "model");
    expect(byDefault.slope_model.window).toEqual([byDefault.information_region.from, byDefault.information_region.to]);
    const refused = await runCliInProcess(["precision", "--genotype", "wt", "--channel", "glm", "--window", "60:300", "--db", db], {}, dir);
    expect(refused.code).toBe(1);
    expect(refused.stderr).toContain("add --derivative model");
  });

  it("precision with two channels adds the joint positional error", async () => {
    const out = await json("precision", "--genotype", "wt", "--channel", "glm,vellin", "--bootstrap", "30");
    expect(out.joint.channels).toEqual(["glm", "vellin"]);
    // common practice, no source: the joint readout uses the same stated region as each channel.
    expect(out.joint.information_region).toEqual(out.information_region);
    expect(out.joint.sigma_x_summary.ci95[0]).toBeLessThan(out.joint.sigma_x_summary.value);
    expect(out.per_channel[0].channel).toBe("vellin");
  });

  it("compare --json shows tardy's λ exceeds wild type's by about √2, as generated, and glm-2x's does not", async () => {
    await cli("fit", "--channel", "glm", "--model", "finite", "--window", "30:");
    const out = await json("compare", "--channel", "glm", "--fit-model", "finite", "--reference", "wt", "--genotype", "wt,tardy,glm-2x", "--permutations", "2000");
    expect(out.groups.map((g: { name: string }) => g.name).sort()).toEqual(["glm-2x", "tardy", "wt"]);
    const wt = out.groups.find((g: { name: string }) => g.name === "wt");
    expect(Object.keys(wt.lambda_um)).toEqual(expect.arrayContaining(["mean", "sd", "sem", "median", "ci95"]));
    const tardy = out.contrasts.find((c: { a: string }) => c.a === "tardy");
    expect(tardy.b).toBe("wt");
    expect(tardy.ratio.ci95[0]).toBeLessThan(TARDY_OVER_WT * 1.03);
    expect(tardy.ratio.ci95[1]).toBeGreaterThan(TARDY_OVER_WT * 0.97);
    expect(tardy.p_holm).toBeLessThan(0.01);
    const dose = out.contrasts.find((c: { a: string }) => c.a === "glm-2x");
    expect(dose.ratio.ci95[0]).toBeLessThan(1.03);
    expect(dose.ratio.ci95[1]).toBeGreaterThan(0.97);
    for (const c of out.contrasts) expect(Object.keys(c)).toEqual(expect.arrayContaining(["a", "b", "difference", "ratio", "p_welch", "p_permutation", "p_holm", "effect_size"]));
    // Source: Welch 1947 / Fieller 1954 — the headline intervals say how they were formed; the bootstrap rides along.
    expect(tardy.difference.interval_method).toMatch(/Welch t/);
    expect(tardy.ratio.interval_method).toMatch(/Fieller/);
    expect(tardy.ratio.bootstrap_ci95).toHaveLength(2);
    expect(wt.lambda_um.ci_method).toMatch(/^t interval/);
    const text = (await cli("compare", "--channel", "glm", "--fit-model", "finite", "--reference", "wt", "--genotype", "wt,tardy", "--permutations", "999")).stdout;
    expect(text).toContain("difference [95% CI, Welch t]");
    expect(text).toContain("ratio [95% CI, Fieller]");
    expect(text).toContain("95% CI of mean (t)");
    expect(text).toContain("Second opinion, not the headline: bootstrap intervals");
  });

  it("track --over dosage estimates λ from the boundary shift and finds it agrees with the fits", async () => {
    const out = await json("track", "--over", "dosage", "--channel", "glm", "--fit-model", "finite", "--genotype", "glm-0.5x,wt,glm-2x,glm-4x");
    const shift = out.result.lambda_from_shift_um;
    // Source: Δx = λ·ln f for an exponential gradient read at a fixed threshold (METHODS.md §5).
    expect(shift.ci95[0]).toBeLessThan(WT_LAMBDA);
    expect(shift.ci95[1]).toBeGreaterThan(WT_LAMBDA);
    expect(out.result.agree).toBe(true);
    expect(out.result.dosages.map((d: { dosage: number }) => d.dosage)).toEqual([0.5, 1, 2, 4]);
    // Every embryo is accounted for: crossed plus never crossed, per dosage.
    for (const d of out.result.dosages) expect(d.n + d.no_crossing.before_start + d.no_crossing.beyond_end).toBe(d.n_embryos);
    expect(out.result.shift_method).toMatch(/least squares|censored-normal/);
    const text = (await cli("track", "--over", "dosage", "--channel", "glm", "--fit-model", "finite", "--genotype", "glm-0.5x,wt,glm-2x,glm-4x")).stdout;
    expect(text).toMatch(/dosage 0\.5×: \d+ embryos, \d+ never cross the threshold/);
    expect(text).toContain("method: ");
  });

  it("track refuses a dosage series that mixes two dosage-1 genotypes", async () => {
    const r = await runCliInProcess(["track", "--over", "dosage", "--channel", "glm", "--db", db], {}, dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain("Several genotypes have dosage 1");
  });

  it("track --over age and --over length report trends and scaling slopes per genotype", async () => {
    const age = await json("track", "--over", "age", "--channel", "glm", "--genotype", "wt,tardy", "--fit-model", "finite");
    expect(age.result.series.map((s: { group: string }) => s.group).sort()).toEqual(["tardy", "wt"]);
    const length = await json("track", "--over", "length", "--channel", "glm", "--genotype", "wt", "--fit-model", "finite");
    expect(length.result.groups[0].lambda.slope.ci95).toHaveLength(2);
  });

  it("plan --json gives the embryos per group from the observed variability, matching the normal-approximation formula", async () => {
    const out = await json("plan", "--effect", "0.15", "--channel", "glm", "--group", "wt");
    // Source: n = 2(z_{1−α/2} + z_{1−β})² CV²/Δ² (Chow, Shao & Wang 2008, §3.2; value from memory).
    const z = normalQuantile(0.975) + normalQuantile(0.8);
    expect(out.n_normal).toBe(Math.ceil((2 * z * z * out.cv ** 2) / 0.15 ** 2));
    expect(out.n_required).toBeGreaterThanOrEqual(out.n_normal);
    expect(out.table.length).toBeGreaterThan(0);
  });

  it("plan without --group uses the most variable selected genotype and names it", async () => {
    // common practice, no source: the conservative default plans for the group hardest to measure.
    const out = await json("plan", "--effect", "0.15", "--channel", "glm", "--genotype", "wt,tardy");
    const v = out.variability_group;
    expect(v.rule).toBe("most_variable");
    expect(v.candidates.map((c: { group: string }) => c.group).sort()).toEqual(["tardy", "wt"]);
    expect(v.cv).toBe(Math.max(...v.candidates.map((c: { cv: number }) => c.cv)));
    expect(out.cv).toBeCloseTo(v.cv, 12);
    expect(out.group).toBe(v.group);
    const text = (await cli("plan", "--effect", "0.15", "--channel", "glm", "--genotype", "wt,tardy")).stdout;
    expect(text).toContain(`Used the variability from "${v.group}"`);
    expect(text).toContain("most variable");
  });

  it("analysis commands name a wrong genotype or channel plainly", async () => {
    const r = await runCliInProcess(["fit", "--genotype", "nonesuch", "--db", db], {}, dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain('No stored profiles match genotype "nonesuch"');
    const c = await runCliInProcess(["precision", "--genotype", "wt", "--db", db], {}, dir);
    expect(c.code).toBe(1);
    expect(c.stderr).toContain("Several channels are stored (glm, glm-gfp, vellin)");
  });
});
