import Database from "better-sqlite3";
import { describe, expect, it } from "vitest";
import { openDatabaseSync } from "../../db/connection.ts";
import { applyMigrations, loadMigrations } from "../../db/migrate.ts";
import { deleteImport, listImports } from "../../db/imports.ts";
import { listFits } from "../../db/fits.ts";
import { loadProfiles } from "../../db/profiles.ts";
import { toBlob } from "../../db/floatBlob.ts";
import { ImportOptions } from "../../server/import/importOptions.ts";
import { importFiles } from "../../server/services/importFiles.ts";
import { bindToInputs } from "../../server/services/bindToInputs.ts";
import { prepareFitInput, storeFitOutput } from "../../server/services/fits/fitService.ts";
import { FitRequest } from "../../server/services/fits/fitRequest.ts";
import { runFitTask } from "../../server/services/fits/fitTask.ts";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";
import { awaitJob, postJson } from "../helpers/awaitJob.ts";
import { PAGE_WRITE_HEADERS, startTestServer, uploadForm } from "../helpers/testServer.ts";

// Results must stay attached to the embryos they were computed from (common practice, no source).
const enc = (s: string) => new TextEncoder().encode(s);
/** A wide table of noise-free exponentials c = 1000·exp(−x/λ) + 10 (a.u.), x every 10 µm. */
const exponentials = (labels: string[], lambdaUm: number) =>
  `position [µm],${labels.join(",")}\n${Array.from({ length: 30 }, (_, i) => `${i * 10},${labels.map((_, k) => (1000 * Math.exp((-i * 10) / lambdaUm) + 10 + k * 0.001).toFixed(6)).join(",")}`).join("\n")}\n`;

describe("ids are never reused", () => {
  it("migration 004 rebuilds every id table with AUTOINCREMENT, keeping every row and foreign key", () => {
    const db = new Database(":memory:");
    db.pragma("foreign_keys = ON");
    applyMigrations(db, loadMigrations().filter((m) => m.version < 4));
    importFiles(db, [{ name: "x.csv", bytes: enc(exponentials(["A1", "A2", "A3"], 40)) }], ImportOptions.parse({ genotype: "wt" }));
    const input = prepareFitInput(db, FitRequest.parse({}));
    storeFitOutput(db, input, runFitTask(input));
    const before = databaseSnapshot(db);
    expect(applyMigrations(db)).toEqual(loadMigrations().filter((m) => m.version >= 4).map((m) => m.version));
    const after = databaseSnapshot(db);
    for (const t of ["imports", "embryos", "profiles", "fits", "analyses", "analysis_inputs"]) expect(after.counts[t]).toBe(before.counts[t]);
    expect(db.pragma("foreign_key_check")).toEqual([]);
    expect(db.pragma("foreign_keys", { simple: true })).toBe(1);
    for (const t of ["imports", "embryos", "profiles", "fits", "analyses"]) {
      const sql = (db.prepare("SELECT sql FROM sqlite_master WHERE name = ?").get(t) as { sql: string }).sql;
      expect(sql).toMatch(/id\s+INTEGER\s+PRIMARY\s+KEY\s+AUTOINCREMENT/i);
    }
    // The indexes of the rebuilt tables are back (the unique profile identity among them).
    const indexes = (db.prepare("SELECT name FROM sqlite_master WHERE type = 'index'").all() as { name: string }[]).map((r) => r.name);
    expect(indexes).toEqual(expect.arrayContaining(["profiles_identity", "profiles_import", "analyses_kind"]));
    // Fits still cascade with their profile after the rebuild.
    const maxProfile = (db.prepare("SELECT MAX(id) AS m FROM profiles").get() as { m: number }).m;
    expect(listFits(db, { profileIds: [maxProfile] }).length).toBe(1);
  });

  it("after deleting the newest import, the next import's profiles get new ids", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "x.csv", bytes: enc(exponentials(["X1", "X2"], 40)) }], ImportOptions.parse({ genotype: "wt" }));
    const xIds = loadProfiles(db).map((p) => p.profileId);
    const xImport = listImports(db)[0].id;
    deleteImport(db, xImport);
    importFiles(db, [{ name: "y.csv", bytes: enc(exponentials(["X1", "X2"], 150)) }], ImportOptions.parse({ genotype: "wt" }));
    const yIds = loadProfiles(db).map((p) => p.profileId);
    expect(yIds.some((id) => xIds.includes(id))).toBe(false);
    expect(listImports(db)[0].id).toBeGreaterThan(xImport);
  });
});

describe("a job stores its result only on unchanged inputs", () => {
  it("the id-reuse sequence (fit queued on X, X deleted, Y imported) stores nothing on Y and says why", async () => {
    const s = await startTestServer();
    try {
      // A long job first, so the fit waits in the queue (one worker).
      const long = await postJson(`${s.url}/api/jobs/self-test`, { n: 40, delayMs: 25 });
      expect(long.status).toBe(202);
      const x = await fetch(`${s.url}/api/imports`, { method: "POST", headers: PAGE_WRITE_HEADERS, body: uploadForm({ "x.csv": exponentials(["E1", "E2", "E3"], 40) }, { genotype: "wt" }) });
      expect(x.status).toBe(200);
      const xProfiles = loadProfiles(s.db).map((p) => p.profileId);
      const fit = await postJson(`${s.url}/api/fits`, { selection: { profileIds: xProfiles } });
      expect(fit.status).toBe(202);
      expect(fit.body.status).toBe("queued");
      const importId = listImports(s.db)[0].id;
      expect((await fetch(`${s.url}/api/imports/${importId}`, { method: "DELETE", headers: PAGE_WRITE_HEADERS })).status).toBe(200);
      const y = await fetch(`${s.url}/api/imports`, { method: "POST", headers: PAGE_WRITE_HEADERS, body: uploadForm({ "y.csv": exponentials(["E1", "E2", "E3"], 150) }, { genotype: "wt" }) });
      expect(y.status).toBe(200);
      const done = await awaitJob(s.url, fit.body.id, 120_000);
      expect(done.status).toBe("failed");
      expect(done.error!.code).toBe("inputs-changed");
      expect(done.error!.message).toMatch(/Nothing was stored: of the 3 profiles .* 3 were deleted/);
      expect(s.db.prepare("SELECT COUNT(*) AS n FROM fits").get()).toEqual({ n: 0 });
      expect(s.db.prepare("SELECT COUNT(*) AS n FROM analyses").get()).toEqual({ n: 0 });
      // The failure is kept with the job in the database too.
      const row = s.db.prepare("SELECT status, error_json FROM jobs WHERE id = ?").get(fit.body.id) as { status: string; error_json: string };
      expect(row.status).toBe("failed");
      expect(JSON.parse(row.error_json).code).toBe("inputs-changed");
    } finally {
      await s.close();
    }
  }, 180_000);

  it("a profile changed in place after the job read it is detected by its content hash", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "x.csv", bytes: enc(exponentials(["E1", "E2"], 40)) }], ImportOptions.parse({ genotype: "wt" }));
    const input = prepareFitInput(db, FitRequest.parse({}));
    const bound = bindToInputs(db, input.profiles.map((p) => p.profileId), (out: ReturnType<typeof runFitTask>) => storeFitOutput(db, input, out));
    const output = runFitTask(input);
    db.prepare("UPDATE profiles SET intensities = ? WHERE id = ?").run(toBlob(Array.from({ length: 30 }, () => 1)), input.profiles[1].profileId);
    const before = databaseSnapshot(db);
    expect(() => bound.finish(output)).toThrow(/1 changed \(profile id \d+\)/);
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("fits and their global fits are stored in one transaction: a failure storing the global fit stores no fit", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "x.csv", bytes: enc(exponentials(["E1", "E2", "E3"], 40)) }], ImportOptions.parse({ genotype: "wt" }));
    const input = prepareFitInput(db, FitRequest.parse({ global: true }));
    const output = runFitTask(input);
    expect(output.globals.length).toBeGreaterThan(0);
    db.exec("CREATE TRIGGER refuse BEFORE INSERT ON analyses BEGIN SELECT RAISE(ABORT, 'refused for the test'); END");
    const before = databaseSnapshot(db);
    expect(() => storeFitOutput(db, input, output)).toThrow(/refused for the test/);
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("a selection of 40,000 profile ids is answered, not a 500 (one bound parameter, not one per id)", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "x.csv", bytes: enc(exponentials(["E1"], 40)) }], ImportOptions.parse({ genotype: "wt" }));
    const ids = Array.from({ length: 40_000 }, (_, i) => i + 1);
    expect(loadProfiles(db, { profileIds: ids }).length).toBe(1);
    expect(listFits(db, { profileIds: ids })).toEqual([]);
  });
});
