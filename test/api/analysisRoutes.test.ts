import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { awaitJob, postJson } from "../helpers/awaitJob.ts";
import { startTestServer, type TestServer } from "../helpers/testServer.ts";

// Every analysis runs as a job, stores its settings and answers with typed results;
// mistakes in the request are 4xx naming the field (common practice, no source).
describe("analysis API", () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ demo: true });
  });
  afterAll(async () => s.close());

  it("POST /api/fits runs a fit job whose result matches GET /api/fits and GET /api/fits/:id", async () => {
    const start = await postJson(`${s.url}/api/fits`, { selection: { genotype: "wt", channel: "glm" }, models: ["exponential", "finite"], options: { window: { xMinUm: 30 } }, global: true });
    expect(start.status).toBe(202);
    const job = await awaitJob(s.url, start.body.id);
    expect(job.status).toBe("done");
    expect(job.result.fits).toHaveLength(60);
    expect(job.result.global).toHaveLength(2);
    const listed = (await (await fetch(`${s.url}/api/fits?genotype=wt&channel=glm&model=finite`)).json()).fits;
    expect(listed).toHaveLength(30);
    const fromJob = job.result.fits.find((f: { model: string; embryo: string }) => f.model === "finite" && f.embryo === listed[0].embryo);
    expect(listed[0].lambdaUm.value).toBe(fromJob.lambda_um.value);
    const one = await (await fetch(`${s.url}/api/fits/${fromJob.fit_id}`)).json();
    expect(one.result.fit.xUm.length).toBe(one.result.fit.residuals.length);
    expect(one.profile.embryo).toBe(fromJob.embryo);
    expect(one.options.window).toEqual({ xMinUm: 30 });
    expect(one.engineVersion).toMatch(/morphogauge-engine/);
    const analysis = await (await fetch(`${s.url}/api/analyses/${job.result.global[0].analysis_id}`)).json();
    expect(analysis).toMatchObject({ kind: "global-fit", selection: { genotype: "wt", channel: "glm" } });
    expect(analysis.profileIds).toHaveLength(30);
  });

  it("POST /api/fits names bad options and unknown selections", async () => {
    const bad = await postJson(`${s.url}/api/fits`, { models: ["gaussian"] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe("body.models.0");
    const opt = await postJson(`${s.url}/api/fits`, { options: { window: { xMinUm: 50, xMaxUm: 10 } } });
    expect(opt.status).toBe(400);
    expect(opt.body.error.message).toContain("options.window");
    const none = await postJson(`${s.url}/api/fits`, { selection: { genotype: "nonesuch" } });
    expect(none.status).toBe(404);
    expect(none.body.error.message).toContain('genotype "nonesuch"');
  });

  it("POST /api/precision reports progress and ends with σ_x, boundary and positional information, stored as an analysis", async () => {
    const start = await postJson(`${s.url}/api/precision`, { selection: { genotype: "tardy" }, channels: ["glm"], bootstrap: 100 });
    expect(start.status).toBe(202);
    const job = await awaitJob(s.url, start.body.id);
    expect(job.status).toBe("done");
    const r = job.result.results[0];
    expect(r).toMatchObject({ group: "tardy", channel: "glm", n_embryos: 30 });
    expect(r.sigma_x.length).toBe(r.x.length);
    const stored = await (await fetch(`${s.url}/api/analyses/${r.analysis_id}`)).json();
    expect(stored.kind).toBe("precision");
    expect(stored.settings).toMatchObject({ bootstrap: 100, seed: 1, normalisation: "none" });
  });

  it("POST /api/precision refuses an ambiguous channel and too few embryos", async () => {
    const amb = await postJson(`${s.url}/api/precision`, { selection: { genotype: "wt" } });
    expect(amb.status).toBe(400);
    expect(amb.body.error.message).toContain("Several channels are stored");
    const few = await postJson(`${s.url}/api/precision`, { selection: { embryo: "wt-01" }, channels: ["glm"] });
    expect(few.status).toBe(202);
    const job = await awaitJob(s.url, few.body.id);
    expect(job.status).toBe("failed");
    expect(job.error!.message).toContain("at least 3");
  });

  it("POST /api/comparisons, /api/tracking and /api/plans run as jobs and store their analyses", async () => {
    const cmp = await awaitJob(s.url, (await postJson(`${s.url}/api/comparisons`, { channel: "glm", fits: "exponential", selection: { genotypes: ["wt", "tardy"] }, permutations: 999, bootstrap: 500 })).body.id);
    expect(cmp.status).toBe("done");
    expect(cmp.result.contrasts).toHaveLength(1);
    const trk = await awaitJob(s.url, (await postJson(`${s.url}/api/tracking`, { channel: "glm", fits: "exponential", over: "length", selection: { genotype: "wt" } })).body.id);
    expect(trk.status).toBe("done");
    expect(trk.result.over).toBe("length");
    const plan = await awaitJob(s.url, (await postJson(`${s.url}/api/plans`, { channel: "glm", fits: "exponential", effect: 0.2, simulations: 200, permutationSimulations: 0 })).body.id);
    expect(plan.status).toBe("done");
    expect(plan.result.n_required).toBeGreaterThan(1);
    const kinds = (await (await fetch(`${s.url}/api/analyses`)).json()).analyses.map((a: { kind: string }) => a.kind);
    expect(kinds).toEqual(expect.arrayContaining(["comparison", "tracking", "plan", "precision", "global-fit"]));
  });

  it("an unknown reference group fails the comparison job with a readable message", async () => {
    const job = await awaitJob(s.url, (await postJson(`${s.url}/api/comparisons`, { channel: "glm", fits: "exponential", reference: "nonesuch", permutations: 99, bootstrap: 100 })).body.id);
    expect(job.status).toBe("failed");
    expect(job.error!.code).not.toBe("internal");
    expect(job.error!.message).toContain("nonesuch");
  });

  it("POST /api/comparisons without a fit setting refuses with 409, listing each stored setting and its coverage per genotype", async () => {
    // wt was fitted with the exponential and the finite model over 30– µm, and with the default exponential fit.
    const res = await postJson(`${s.url}/api/comparisons`, { channel: "glm", by: "stage", selection: { genotype: "wt" } });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("choose-fit-setting");
    const settings = (await (await fetch(`${s.url}/api/fit-settings?channel=glm`)).json()).settings as { name: string; coverage: { genotype: string; fitted: number; profiles: number }[] }[];
    expect(settings.length).toBeGreaterThan(1);
    for (const st of settings) {
      const wt = st.coverage.find((c) => c.genotype === "wt")!;
      if (wt.fitted > 0) expect(res.body.error.message).toContain(`${st.name} (`);
    }
  });

  it("POST /api/exclusions and /api/inclusions exclude and include an embryo; the next comparison lists it and has one embryo fewer", async () => {
    const ex = await postJson(`${s.url}/api/exclusions`, { embryo: "tdy-07", reason: "torn membrane" });
    expect(ex.status).toBe(201);
    expect((await (await fetch(`${s.url}/api/exclusions`)).json()).current).toEqual([expect.objectContaining({ embryo: "tdy-07", reason: "torn membrane", scope: "embryo" })]);
    const cmp = await awaitJob(s.url, (await postJson(`${s.url}/api/comparisons`, { channel: "glm", fits: "exponential", selection: { genotypes: ["wt", "tardy"] }, permutations: 99, bootstrap: 100 })).body.id);
    expect(cmp.result.groups.find((g: { name: string }) => g.name === "tardy").n).toBe(29);
    expect(cmp.result.left_out).toEqual([expect.objectContaining({ embryo: "tdy-07", reason: "torn membrane" })]);
    expect(cmp.result.fit_ids).toHaveLength(59);
    const noReason = await postJson(`${s.url}/api/exclusions`, { embryo: "tdy-08", reason: " " });
    expect(noReason.status).toBe(400);
    expect((await postJson(`${s.url}/api/inclusions`, { embryo: "tdy-07" })).status).toBe(200);
    expect((await (await fetch(`${s.url}/api/exclusions`)).json()).current).toEqual([]);
  });

  it("GET /api/analyses/:id is 404 for an unknown id", async () => {
    expect((await fetch(`${s.url}/api/analyses/99999`)).status).toBe(404);
    expect((await fetch(`${s.url}/api/fits/99999`)).status).toBe(404);
  });
});

describe("stored fit listing", () => {
  it("GET /api/fits gives Akaike weights across the models stored for a profile over the same window, summing to 1", async () => {
    const s = await startTestServer({ demo: true });
    try {
      const job = await awaitJob(s.url, (await postJson(`${s.url}/api/fits`, { selection: { embryo: "wt-02", channel: "glm" }, models: ["exponential", "finite", "power"], options: { window: { xMinUm: 30 } } })).body.id);
      expect(job.status).toBe("done");
      const fits = (await (await fetch(`${s.url}/api/fits?channel=glm`)).json()).fits;
      const weights = fits.map((f: { akaikeWeight: number }) => f.akaikeWeight);
      expect(weights.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 12);
      // The job's own ranking and the listing agree (same AICc values). Source: Burnham & Anderson 2002, Akaike weights.
      for (const f of fits) {
        const fromJob = job.result.fits.find((j: { fit_id: number }) => j.fit_id === f.fitId);
        expect(f.akaikeWeight).toBeCloseTo(fromJob.akaike_weight, 12);
      }
    } finally {
      await s.close();
    }
  });
});
