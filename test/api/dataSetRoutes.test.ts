import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DataSets } from "../../server/services/datasets/dataSets.ts";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";
import { startTestServer, uploadForm, type TestServer } from "../helpers/testServer.ts";

// The demo and the lab's data never mix (common practice, no source): what `npm start` does —
// serve the demo from its own file — then an upload of wild types.
const upload = "embryo,genotype,position [µm],intensity\n" + ["lab-1", "lab-2", "lab-3"].flatMap((e, k) => [0, 1, 2, 3, 4, 5].map((i) => `${e},wt,${i * 10},${200 - i * 15 + k}`)).join("\n") + "\n";

describe("data sets: the demo apart from the lab's data", () => {
  let s: TestServer;
  let datasets: DataSets;
  let dir: string;
  const get = async (path: string) => (await fetch(`${s.url}${path}`)).json();
  const post = (path: string, body: unknown) => fetch(`${s.url}${path}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "mg-datasets-"));
    datasets = await DataSets.open({ userPath: join(dir, "morphogauge.db"), demoPath: join(dir, "morphogauge-demo.db"), start: "demo" });
    s = await startTestServer({ datasets });
  }, 60_000);
  afterAll(async () => s?.close());

  it("GET /api/datasets says the demo is open and offers the lab's file, not created yet", async () => {
    const answer = await get("/api/datasets");
    expect(answer.current).toMatchObject({ id: "demo", kind: "demo", current: true });
    expect(answer.available.map((d: { id: string; kind: string; exists: boolean }) => [d.id, d.kind, d.exists])).toEqual([
      ["demo", "demo", true],
      ["morphogauge.db", "user", false],
    ]);
  });

  it("an upload while the demo is open is refused; after switching it lands in the lab's file only, and the demo's groups are unchanged", async () => {
    const demoBefore = databaseSnapshot(datasets.db);
    const wtBefore = (await get("/api/profiles?genotype=wt")).total;
    expect(wtBefore).toBeGreaterThan(0);
    for (const path of ["/api/imports/preview", "/api/imports"]) {
      const refused = await fetch(`${s.url}${path}`, { method: "POST", body: uploadForm({ "lab.csv": upload }) });
      expect(refused.status).toBe(409);
      const err = (await refused.json()).error;
      expect(err.code).toBe("demo-is-open");
      expect(err.message).toContain("switch to it (or create a new one)");
    }
    const switched = await post("/api/datasets/switch", { id: "morphogauge.db" });
    expect(switched.status).toBe(200);
    expect((await switched.json()).current).toMatchObject({ id: "morphogauge.db", kind: "user", exists: true });
    const imported = await (await fetch(`${s.url}/api/imports`, { method: "POST", body: uploadForm({ "lab.csv": upload }) })).json();
    expect(imported.files[0]).toMatchObject({ status: "imported", embryosAdded: 3, embryosMatched: 0 });
    const mine = await get("/api/profiles");
    expect(mine.total).toBe(3);
    expect(mine.items.map((p: { embryo: string }) => p.embryo).sort()).toEqual(["lab-1", "lab-2", "lab-3"]);
    expect((await get("/api/groups?by=genotype")).values).toEqual(["wt"]);
    expect((await post("/api/datasets/switch", { id: "demo" })).status).toBe(200);
    expect(databaseSnapshot(datasets.db)).toEqual(demoBefore);
    expect((await get("/api/profiles?genotype=wt")).total).toBe(wtBefore);
  });

  it("POST /api/datasets creates a new data set beside the lab's file and opens it; bad names, taken names and unknown ids are refused", async () => {
    const created = await post("/api/datasets", { name: "spring-2026" });
    expect(created.status).toBe(201);
    const answer = await created.json();
    expect(answer.current).toMatchObject({ id: "spring-2026.db", kind: "user", path: join(dir, "spring-2026.db") });
    expect((await get("/api/profiles")).total).toBe(0);
    const bad = await post("/api/datasets", { name: "../elsewhere" });
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.message).toContain("no folders");
    expect((await post("/api/datasets", { name: "spring-2026" })).status).toBe(409);
    expect((await post("/api/datasets/switch", { id: "nope.db" })).status).toBe(404);
    // A server started later finds the new data set again.
    const later = await DataSets.open({ userPath: join(dir, "morphogauge.db"), demoPath: join(dir, "morphogauge-demo.db"), start: "user" });
    expect(later.list().map((d) => d.id)).toEqual(["demo", "morphogauge.db", "spring-2026.db"]);
    later.close();
  });
});
