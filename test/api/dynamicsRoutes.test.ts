import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { loadDynamicsDemo } from "../../server/services/demoData.ts";
import { awaitJob, postJson } from "../helpers/awaitJob.ts";
import { startTestServer, type TestServer } from "../helpers/testServer.ts";

// Dynamics over the API: jobs for fits, immediate answers for the what-if and the combination;
// values checked against the relations they must satisfy (science notes §1–2).
describe("dynamics API", () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ demo: true });
    loadDynamicsDemo(s.db);
  });
  afterAll(async () => s.close());

  it("POST /api/dynamics/simulate answers the build-up at once and stores nothing by default", async () => {
    const r = await postJson(`${s.url}/api/dynamics/simulate`, { diffusionUm2PerS: 0.3, degradationPerS: 2e-4, lengthUm: 500, untilS: 10_800, profiles: 3 });
    expect(r.status).toBe(200);
    expect(r.body.analysis_id).toBeNull();
    expect(r.body.profiles.map((p: { t_s: number }) => p.t_s)).toEqual([3600, 7200, 10_800]);
    // Source: λ = √(D/k) (science notes §1).
    expect(r.body.lambda_um.value).toBeCloseTo(Math.sqrt(0.3 / 2e-4), 10);
    const bad = await postJson(`${s.url}/api/dynamics/simulate`, { diffusionUm2PerS: -1, degradationPerS: 2e-4, lengthUm: 500, untilS: 100 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe("body.diffusionUm2PerS");
  });

  it("time-course and demo FRAP jobs store their results, and combine joins FRAP D with a stored global fit", async () => {
    const tc = await postJson(`${s.url}/api/dynamics/time-course`, { selection: { channel: "glm-gfp" }, options: { profilePoints: 9 } });
    expect(tc.status).toBe(202);
    const tcJob = await awaitJob(s.url, tc.body.id, 120_000);
    expect(tcJob.status).toBe("done");
    expect(tcJob.result.groups[0]).toMatchObject({ genotype: "wt", channel: "glm-gfp", status: "ok" });
    const frap = await postJson(`${s.url}/api/dynamics/frap/demo`, {});
    const frapJob = await awaitJob(s.url, frap.body.id, 120_000);
    expect(frapJob.status).toBe("done");
    expect(frapJob.result.n_fitted).toBe(3);
    const fit = await postJson(`${s.url}/api/fits`, { selection: { genotype: "wt", channel: "glm" }, models: ["exponential"], options: { window: { xMinUm: 30 } }, global: true });
    expect((await awaitJob(s.url, fit.body.id, 120_000)).status).toBe("done");
    const c = await postJson(`${s.url}/api/dynamics/combine`, { frapAnalysisId: frapJob.result.analysis_id, genotype: "wt", channel: "glm" });
    expect(c.status).toBe(200);
    // Source: k = D/λ² (science notes §1).
    expect(c.body.k_per_s.value).toBeCloseTo(c.body.D_um2_per_s.value / c.body.lambda_um.value ** 2, 12);
    const list = await (await fetch(`${s.url}/api/dynamics/analyses`)).json();
    expect(list.analyses.map((a: { kind: string }) => a.kind).sort()).toEqual(["combine", "dynamics", "frap"]);
    const one = await (await fetch(`${s.url}/api/dynamics/analyses/${c.body.analysis_id}`)).json();
    expect(one.settings).toMatchObject({ model: "exponential" });
  });
});
