import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";
import { startTestServer, uploadForm, type TestServer } from "../helpers/testServer.ts";

// API conventions of this project: zod-validated requests, {error:{code,message,issues}} bodies,
// 4xx for user mistakes (common practice, no source).
const good = "embryo,genotype,position [µm],intensity\n" + [0, 1, 2, 3, 4, 5].map((i) => `A1,wt,${i * 5},${100 - i * 9}`).join("\n") + "\n";
const bad = "embryo,position [µm],intensity\n" + [0, 1, 2, 3, 4].map((i) => `B1,${i},${i === 3 ? "n/a?" : 9 - i}`).join("\n") + "\n";

describe("import and profile API", () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => s.close());

  it("GET /api/health answers", async () => {
    expect(await (await fetch(`${s.url}/api/health`)).json()).toMatchObject({ ok: true });
  });

  it("POST /api/imports/preview parses without storing", async () => {
    const before = databaseSnapshot(s.db);
    const r = await fetch(`${s.url}/api/imports/preview`, { method: "POST", body: uploadForm({ "good.csv": good, "bad.csv": bad }) });
    expect(r.status).toBe(200);
    const body = await r.json();
    expect(body.files[0]).toMatchObject({ file: "good.csv", status: "ok", format: "long", delimiter: "," });
    expect(body.files[0].columns.map((c: { role: string }) => c.role)).toEqual(["embryo", "genotype", "position", "intensity"]);
    expect(body.files[0].embryos[0]).toMatchObject({ label: "A1", genotype: "wt", profiles: [{ points: 6, positionUnit: "um" }] });
    expect(body.files[1].status).toBe("rejected");
    expect(body.files[1].error.message).toContain('bad.csv, row 5, column "intensity": "n/a?" is not a number');
    expect(databaseSnapshot(s.db)).toEqual(before);
  });

  it("POST /api/imports stores good files, rejects bad ones whole, and is idempotent", async () => {
    const r = await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "good.csv": good, "bad.csv": bad }, { channel: "glm" }) });
    expect(r.status).toBe(200);
    const body = await r.json();
    expect(body.files.map((f: { status: string }) => f.status)).toEqual(["imported", "rejected"]);
    const again = await (await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "good.csv": good }, { channel: "glm" }) })).json();
    expect(again.files[0].status).toBe("already-imported");
    expect(again.files[0].message).toContain("with the same options and side file");
    const onlyBad = await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "bad.csv": bad }) });
    expect(onlyBad.status).toBe(422);
  });

  it("POST /api/imports/preview compares with the database: a stored embryo with another length is a conflict until onConflict chooses", async () => {
    const longer = "embryo,genotype,length [µm],channel,position [µm],intensity\n" + [0, 1, 2, 3, 4, 5].map((i) => `A1,wt,480,second,${i * 10},${60 - i * 5}`).join("\n") + "\n";
    await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "len.csv": longer.replaceAll("480", "520").replaceAll("second", "first") }) });
    const before = databaseSnapshot(s.db);
    const refuse = (await (await fetch(`${s.url}/api/imports/preview`, { method: "POST", body: uploadForm({ "longer.csv": longer }) })).json()).files[0];
    expect(refuse.status).toBe("conflicts");
    expect(refuse.database.stored[0]).toMatchObject({ label: "A1", newProfiles: ["second"], conflicts: [{ name: "length (µm)", stored: 520, file: 480 }] });
    const replace = (await (await fetch(`${s.url}/api/imports/preview`, { method: "POST", body: uploadForm({ "longer.csv": longer }, { onConflict: "replace" }) })).json()).files[0];
    expect(replace.status).toBe("ok");
    expect(replace.outcome.message).toContain("replaced the length (µm) of 1 embryo");
    const stored = await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "longer.csv": longer }) });
    expect(stored.status).toBe(422);
    expect((await stored.json()).files[0].error.code).toBe("import-conflicts");
    expect(databaseSnapshot(s.db)).toEqual(before);
    const bad = await fetch(`${s.url}/api/imports/preview`, { method: "POST", body: uploadForm({ "longer.csv": longer }, { onConflict: "overwrite" }) });
    expect(bad.status).toBe(400);
    const imports = (await (await fetch(`${s.url}/api/imports`)).json()).imports;
    expect((await fetch(`${s.url}/api/imports/${imports.at(-1).id}`, { method: "DELETE" })).status).toBe(200);
  });

  it("POST /api/imports joins a metadata side file and honours form options", async () => {
    const wide = "x (px),W1,W2\n" + [0, 1, 2, 3, 4].map((i) => `${i * 10},${50 - i},${60 - i}`).join("\n");
    const r = await (await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "w.csv": wide }, { pixelSizeUm: "0.5" }, ["m.csv", "embryo,genotype,length [µm]\nW1,mut,400\nW2,mut,410\n"]) })).json();
    expect(r.files[0]).toMatchObject({ status: "imported", profilesAdded: 2 });
    const list = await (await fetch(`${s.url}/api/profiles?genotype=mut`)).json();
    expect(list.total).toBe(2);
    expect(list.items[0]).toMatchObject({ embryo: "W1", lengthUm: 400, positionUnit: "px", pixelSizeUm: 0.5, rangeUm: [0, 20] });
  });

  it("POST /api/imports refuses a request without files, with a bad option, or not multipart", async () => {
    const none = await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({}, { channel: "x" }) });
    expect(none.status).toBe(400);
    expect((await none.json()).error.message).toContain("No file was uploaded");
    const badOpt = await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "g.csv": good }, { flip: "sideways" }) });
    expect(badOpt.status).toBe(400);
    const err = (await badOpt.json()).error;
    expect(err.code).toBe("invalid-request");
    expect(err.issues[0].path).toBe("body.flip");
    const json = await fetch(`${s.url}/api/imports`, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" });
    expect(json.status).toBe(415);
  });

  it("GET /api/profiles filters by metadata and paginates; GET /api/profiles/:id returns the arrays", async () => {
    const page = await (await fetch(`${s.url}/api/profiles?limit=1&offset=1`)).json();
    expect(page).toMatchObject({ total: 3, limit: 1, offset: 1 });
    expect(page.items).toHaveLength(1);
    const one = await (await fetch(`${s.url}/api/profiles/${page.items[0].profileId}`)).json();
    expect(one.positionsUm.length).toBe(one.nPoints);
    expect((await fetch(`${s.url}/api/profiles/99999`)).status).toBe(404);
    const bad = await fetch(`${s.url}/api/profiles?limit=0`);
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.issues[0].path).toBe("query.limit");
    const groups = await (await fetch(`${s.url}/api/groups?by=genotype`)).json();
    expect(groups.values).toEqual(["mut", "wt"]);
  });

  it("DELETE /api/imports/:id removes only that import; unknown ids are 404", async () => {
    const imports = (await (await fetch(`${s.url}/api/imports`)).json()).imports;
    const last = imports.at(-1);
    const r = await (await fetch(`${s.url}/api/imports/${last.id}`, { method: "DELETE" })).json();
    expect(r.deleted).toEqual({ profiles: 2, embryos: 2, valuesRestored: 0 });
    expect((await (await fetch(`${s.url}/api/profiles`)).json()).total).toBe(1);
    expect((await fetch(`${s.url}/api/imports/${last.id}`, { method: "DELETE" })).status).toBe(404);
    expect((await fetch(`${s.url}/api/imports/abc`, { method: "DELETE" })).status).toBe(400);
  });

  it("unknown API routes are 404 with a JSON error; bad JSON bodies are 400", async () => {
    const r = await fetch(`${s.url}/api/nothing-here`);
    expect(r.status).toBe(404);
    expect((await r.json()).error.code).toBe("not-found");
    const j = await fetch(`${s.url}/api/jobs/self-test`, { method: "POST", headers: { "content-type": "application/json" }, body: "{oops" });
    expect(j.status).toBe(400);
    expect((await j.json()).error.code).toBe("invalid-json");
  });

  it("GET /api/openapi.json is an OpenAPI 3.1 document covering every route, and /api/docs renders it", async () => {
    const doc = await (await fetch(`${s.url}/api/openapi.json`)).json();
    expect(doc.openapi).toBe("3.1.0");
    expect(Object.keys(doc.paths)).toEqual(expect.arrayContaining(["/api/imports", "/api/profiles/{id}", "/api/jobs/{id}/events"]));
    expect(doc.paths["/api/profiles"].get.parameters.map((p: { name: string }) => p.name)).toContain("genotype");
    const html = await (await fetch(`${s.url}/api/docs`)).text();
    expect(html).toContain("/api/imports/preview");
  });

  it("a demo fixture uploads through the API like any other file", async () => {
    const text = readFileSync(new URL("../../fixtures/glimmerin_dosage_series.csv", import.meta.url), "utf8");
    const r = await (await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "glimmerin_dosage_series.csv": text }) })).json();
    expect(r.files[0]).toMatchObject({ status: "imported", profilesAdded: 40 });
  });
});
