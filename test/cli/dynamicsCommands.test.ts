import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { DYNAMICS_FILES, DYNAMICS_SCENARIO } from "../../fixtures/dynamicsDemo.ts";
import { runCliInProcess } from "../helpers/runCliInProcess.ts";

// The demo's generating values are in fixtures/dynamicsDemo.ts (invented data); these end-to-end
// checks recover them within the reported intervals or stated tolerances.
const FIXTURES = join(process.cwd(), "fixtures");
const KEYS = ["D_um2_per_s", "k_per_s", "mobile_fraction", "half_time_s", "lambda_um", "half_life_s", "accumulation_time_s"];

describe("dynamics commands on the demo database", () => {
  const dir = mkdtempSync(join(tmpdir(), "mg-dyn-"));
  const db = join(dir, "demo.db");
  const cli = async (...args: string[]) => runCliInProcess([...args, "--db", db], {}, dir);
  const json = async (...args: string[]) => {
    const r = await cli(...args, "--json");
    if (r.code !== 0) throw new Error(`morphogauge ${args.join(" ")} exited ${r.code}: ${r.stderr}`);
    return JSON.parse(r.stdout);
  };
  let frapId = 0;

  beforeAll(async () => {
    expect((await cli("demo")).code).toBe(0);
  });

  it("dynamics --json fits the build-up time course: D and k near the generating values, every key as {value, se, ci95}", async () => {
    // Source: invented demo, D = 1.35 µm²/s, k = D/82² (fixtures/dynamicsDemo.ts).
    const out = await json("dynamics", "--channel", "glm-gfp");
    const g = out.groups[0];
    for (const key of KEYS) expect(g).toHaveProperty(key);
    // One group: its quantities also stand at the top of the answer.
    for (const key of KEYS) expect(out[key]).toEqual(g[key] ?? null);
    expect(g).toMatchObject({ genotype: "wt", channel: "glm-gfp", status: "ok", n_profiles: 18, identifiable: true });
    expect(Object.keys(g.D_um2_per_s)).toEqual(["value", "se", "ci95"]);
    expect(Math.abs(g.D_um2_per_s.value / DYNAMICS_SCENARIO.diffusionUm2PerS - 1)).toBeLessThan(0.08);
    expect(Math.abs(g.k_per_s.value / DYNAMICS_SCENARIO.degradationPerS - 1)).toBeLessThan(0.08);
    expect(g.accumulation_time_s.length).toBe(5);
    expect(g.accumulation_time_s[0]).toMatchObject({ x_um: 0 });
    expect(g.settings).toMatchObject({ domain: { kind: "semi-infinite" }, covariance: "hc3" });
    expect(g.profile_likelihood_k.length).toBe(21);
  });

  it("frap --json fits the three demo cells: D and mobile fraction with intervals, normalisation stated", async () => {
    // Source: invented demo, per-cell D = 1.35·e^(0.1·z) µm²/s, mobile fraction 0.8 (fixtures/dynamicsDemo.ts).
    const out = await json("frap", ...DYNAMICS_FILES.frap.map((f) => join(FIXTURES, f)), "--geometry", "spot", "--radius", "3");
    for (const key of KEYS) expect(out).toHaveProperty(key);
    expect(out.n_fitted).toBe(3);
    expect(out.D_um2_per_s.value).toBeGreaterThan(1);
    expect(out.D_um2_per_s.value).toBeLessThan(1.6);
    expect(out.mobile_fraction.ci95[0]).toBeLessThan(0.8);
    expect(out.mobile_fraction.ci95[1]).toBeGreaterThan(0.8);
    expect(out.curves[0].normalisation.join(" ")).toMatch(/background.*reference.*pre-bleach/);
    expect(out.caveat).toMatch(/need not be the effective D/);
    frapId = out.analysis_id;
  });

  it("combine --json turns the FRAP D and the stored wt λ into k, half-life, j0 and τ(x) with propagated SEs", async () => {
    await json("fit", "--genotype", "wt", "--channel", "glm", "--window", "30:", "--global");
    const out = await json("combine", "--frap", String(frapId), "--fit", "wt", "--channel", "glm");
    for (const key of KEYS) expect(out).toHaveProperty(key);
    // Source: k = D/λ² and t½ = ln2/k (science notes §1).
    expect(out.k_per_s.value).toBeCloseTo(out.D_um2_per_s.value / out.lambda_um.value ** 2, 12);
    expect(out.half_life_s.value).toBeCloseTo(Math.LN2 / out.k_per_s.value, 6);
    expect(out.k_per_s.se).toBeGreaterThan(0);
    expect(out.source_flux.value).toBeGreaterThan(0);
    expect(out.accumulation_time_s).toHaveLength(4);
  });

  it("combine names the missing group and exits 1", async () => {
    const r = await cli("combine", "--frap", String(frapId), "--fit", "nosuch");
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/no stored global fit .* "nosuch"/);
  });

  it("simulate --json runs the build-up; τ(x) from the simulation matches (1 + x/λ)/(2k) far from the closed end", async () => {
    // Source: Berezhkovskii, Sample & Shvartsman 2010, Biophys J (τ for the influx boundary).
    const out = await json("simulate", "--D", "0.3", "--k", "2e-4", "--flux", "1", "--length", "500", "--until", "3h", "--tau-at", "0,40");
    for (const key of KEYS) expect(out).toHaveProperty(key);
    expect(out.profiles).toHaveLength(6);
    expect(out.profiles[5].t_s).toBe(10_800);
    const lambda = Math.sqrt(0.3 / 2e-4);
    for (const t of out.accumulation_time_s) expect(Math.abs(t.value / ((1 + t.x_um / lambda) / (2 * 2e-4)) - 1)).toBeLessThan(0.01);
    expect(out.analysis_id).toBeGreaterThan(0);
  });

  it("simulate refuses a duration it cannot read, naming the option", async () => {
    const r = await cli("simulate", "--D", "0.3", "--k", "2e-4", "--length", "500", "--until", "three hours");
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/--until: "three hours" is not a duration/);
  });
});
