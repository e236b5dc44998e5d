import type { ChartConfiguration } from "chart.js";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { FIGURE_KINDS } from "../../client/figures/figureRegistry.ts";
import { groupValuesFigure } from "../../client/figures/groupValuesFigure.ts";
import { getAnalysis } from "../../db/analyses.ts";
import { renderChart } from "../../server/figures/renderChart.ts";
import { comparisonResponse } from "../../server/services/groups/comparisonResponse.ts";
import { pngSize } from "../helpers/pngSize.ts";
import { seedAnalyses } from "../helpers/seedAnalyses.ts";
import { seedDynamics } from "../helpers/seedDynamics.ts";
import { startTestServer, type TestServer } from "../helpers/testServer.ts";

// Figure endpoint over the demo data: every kind as PNG and SVG, file names, and the error paths (common practice, no source).
describe("GET /api/figures/:kind", () => {
  let s: TestServer;
  let seeded: ReturnType<typeof seedAnalyses>;
  let dynamics: ReturnType<typeof seedDynamics>;
  beforeAll(async () => {
    s = await startTestServer({ demo: true });
    seeded = seedAnalyses(s.db);
    dynamics = seedDynamics(s.db);
  }, 300_000);
  afterAll(async () => s.close());

  const get = (path: string) => fetch(`${s.url}${path}`);
  const sourceOf = (kind: string): string => {
    const fit = seeded.fits.fits.find((f) => f.status === "converged")!.fit_id;
    const ids: Record<string, string> = {
      "profile-fit": `fit=${fit}`, residuals: `fit=${fit}`, "group-values": `analysis=${seeded.comparison.analysis_id}`,
      ensemble: `analysis=${seeded.precisionGlm.analysis_id}`, "sigma-x": `analysis=${seeded.precisionGlm.analysis_id}`, boundary: `analysis=${seeded.precisionGlm.analysis_id}`,
      "decoding-map": `analysis=${seeded.precisionGlm.analysis_id}`, trend: `analysis=${seeded.tracking.analysis_id}`, power: `analysis=${seeded.plan.analysis_id}`,
      "build-up": `analysis=${dynamics.timeCourse.analysis_id}`, "build-up-residuals": `analysis=${dynamics.timeCourse.analysis_id}`,
      "profile-likelihood-k": `analysis=${dynamics.timeCourse.analysis_id}`, "dk-region": `analysis=${dynamics.timeCourse.analysis_id}`, "accumulation-time": `analysis=${dynamics.timeCourse.analysis_id}`,
      "frap-recovery": `analysis=${dynamics.frap.analysis_id}`, "frap-residuals": `analysis=${dynamics.frap.analysis_id}`, simulation: `analysis=${dynamics.simulation.analysis_id}`,
    };
    return ids[kind];
  };

  for (const kind of FIGURE_KINDS) {
    it(`${kind}: PNG at 300 dpi (1950 × 1200) and SVG (650 × 400), each as a named download`, async () => {
      const png = await get(`/api/figures/${kind}?${sourceOf(kind)}`);
      expect(png.status).toBe(200);
      expect(png.headers.get("content-type")).toBe("image/png");
      expect(png.headers.get("content-disposition")).toMatch(new RegExp(`^attachment; filename="${kind}_[A-Za-z0-9._-]+_(fit|analysis)\\d+\\.png"$`));
      expect(pngSize(Buffer.from(await png.arrayBuffer()))).toEqual({ width: 1950, height: 1200 });
      const svg = await get(`/api/figures/${kind}?${sourceOf(kind)}&format=svg`);
      expect(svg.status).toBe(200);
      expect(svg.headers.get("content-type")).toBe("image/svg+xml");
      expect(svg.headers.get("content-disposition")).toMatch(/\.svg"$/);
      const text = await svg.text();
      expect(text.startsWith("<?xml") || text.startsWith("<svg")).toBe(true);
      expect(text).toMatch(/<svg[^>]*width="650"[^>]*height="400"/);
    });
  }

  it("profile-fit takes scale=log and dpi, and names the file by kind, embryo, channel, model, fit and scale", async () => {
    const fit = seeded.fits.fits[0];
    const res = await get(`/api/figures/profile-fit?fit=${fit.fit_id}&scale=log&dpi=100`);
    expect(res.headers.get("content-disposition")).toBe(`attachment; filename="profile-fit_${fit.embryo}_glm_exponential_fit${fit.fit_id}_log.png"`);
    expect(pngSize(Buffer.from(await res.arrayBuffer()))).toEqual({ width: 650, height: 400 });
  });

  it("the figure of a stored comparison is drawn from exactly the JSON its job answered", async () => {
    const job = await (await fetch(`${s.url}/api/comparisons`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ channel: "glm", permutations: 999, bootstrap: 200, seed: 5 }) })).json();
    let state = job;
    for (let i = 0; i < 600 && (state.status === "queued" || state.status === "running"); i++) {
      await new Promise((r) => setTimeout(r, 100));
      state = await (await get(`/api/jobs/${job.id}`)).json();
    }
    expect(state.status).toBe("done");
    const result = state.result;
    expect(result.embryo_values.groups.map((g: { values: unknown[] }) => g.values.length)).toEqual(result.groups.map((g: { lambda_um: { n: number } }) => g.lambda_um.n));
    expect(JSON.parse(JSON.stringify(comparisonResponse(getAnalysis(s.db, result.analysis_id)!)))).toEqual(result);
    // PNG rendering is byte-for-byte repeatable (SVG clip-path ids are not), so the bytes must match.
    const served = Buffer.from(await (await get(`/api/figures/group-values?analysis=${result.analysis_id}&dpi=100`)).arrayBuffer());
    expect(served.equals(renderChart(groupValuesFigure(result) as unknown as ChartConfiguration, { format: "png", dpi: 100 }))).toBe(true);
  });

  it("channel= picks a channel of a multi-channel precision analysis; an unknown channel is 404", async () => {
    const id = seeded.precisionJoint.analysis_id;
    const vellin = await get(`/api/figures/sigma-x?analysis=${id}&channel=vellin`);
    expect(vellin.status).toBe(200);
    expect(vellin.headers.get("content-disposition")).toBe(`attachment; filename="sigma-x_wt_vellin_analysis${id}.png"`);
    const unknown = await get(`/api/figures/sigma-x?analysis=${id}&channel=nope`);
    expect(unknown.status).toBe(404);
    expect((await unknown.json()).error.code).toBe("unknown-channel");
  });

  it("unknown fit and analysis ids are 404 with the API's error body", async () => {
    for (const [path, code] of [["/api/figures/profile-fit?fit=999999", "unknown-fit"], ["/api/figures/sigma-x?analysis=999999", "unknown-analysis"]]) {
      const res = await get(path);
      expect(res.status).toBe(404);
      const body = await res.json();
      expect(body.error.code).toBe(code);
      expect(body.error.message).toContain("999999");
    }
  });

  it("a figure asked of the wrong kind of source is 400, naming both kinds", async () => {
    const wrongAnalysis = await get(`/api/figures/sigma-x?analysis=${seeded.comparison.analysis_id}`);
    expect(wrongAnalysis.status).toBe(400);
    const body = await wrongAnalysis.json();
    expect(body.error.code).toBe("wrong-source");
    expect(body.error.message).toBe(`Analysis ${seeded.comparison.analysis_id} is a comparison; the sigma-x figure needs a precision analysis.`);
    expect((await get(`/api/figures/profile-fit?analysis=${seeded.precisionGlm.analysis_id}`)).status).toBe(400);
    expect((await get(`/api/figures/power?fit=${seeded.fits.fits[0].fit_id}`)).status).toBe(400);
    expect((await get(`/api/figures/trend?analysis=${seeded.fits.global[0].analysis_id}`)).status).toBe(400);
  });

  it("bad requests are 400 naming the field: unknown kind, bad format, scale or dpi, no source or two", async () => {
    const id = seeded.precisionGlm.analysis_id;
    const cases: [string, string][] = [
      ["/api/figures/pie-chart?analysis=1", "params.kind"],
      [`/api/figures/sigma-x?analysis=${id}&format=gif`, "query.format"],
      [`/api/figures/sigma-x?analysis=${id}&scale=cubic`, "query.scale"],
      [`/api/figures/sigma-x?analysis=${id}&dpi=5000`, "query.dpi"],
      ["/api/figures/sigma-x", "query.fit"],
      [`/api/figures/sigma-x?analysis=${id}&fit=1`, "query.fit"],
      ["/api/figures/sigma-x?analysis=abc", "query.analysis"],
    ];
    for (const [path, field] of cases) {
      const res = await get(path);
      expect(res.status, path).toBe(400);
      expect((await res.json()).error.issues.map((i: { path: string }) => i.path), path).toContain(field);
    }
  });

  it("the OpenAPI document lists the figure and export endpoints with their parameters", async () => {
    const doc = await (await get("/api/openapi.json")).json();
    const figure = doc.paths["/api/figures/{kind}"].get;
    expect(figure.parameters.map((p: { name: string }) => p.name)).toEqual(["kind", "fit", "analysis", "channel", "format", "scale", "dpi"]);
    expect(Object.keys(figure.responses["200"].content)).toEqual(["image/png"]);
    expect(doc.paths["/api/exports/{table}.csv"].get.parameters.map((p: { name: string }) => p.name)).toEqual(["table", "analysis", "channel", "genotype", "model"]);
  });
});
