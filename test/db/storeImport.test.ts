import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Database from "better-sqlite3";
import { describe, expect, it } from "vitest";
import { openDatabase, openDatabaseSync } from "../../db/connection.ts";
import { loadMigrations } from "../../db/migrate.ts";
import { deleteImport, listImports } from "../../db/imports.ts";
import { loadProfiles } from "../../db/profiles.ts";
import { fromBlob, toBlob } from "../../db/floatBlob.ts";
import { ImportOptions } from "../../server/import/importOptions.ts";
import { importFiles } from "../../server/services/importFiles.ts";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";

// Storage rules of this project: atomic, idempotent, nothing lost (common practice, no source).
const enc = (s: string) => new TextEncoder().encode(s);
const wide = (labels: string[], offset = 0) =>
  enc(`position [µm],${labels.join(",")}\n${[0, 1, 2, 3, 4, 5].map((i) => `${i * 10},${labels.map((_, k) => 100 - i * 7 + k + offset).join(",")}`).join("\n")}\n`);
const opts = (o = {}) => ImportOptions.parse(o);

describe("storing imports", () => {
  it("toBlob and fromBlob round-trip Float64 values exactly", () => {
    const v = [0, -1.5, Math.PI, 1e-300, 6.02e23];
    expect(Array.from(fromBlob(toBlob(v)))).toEqual(v);
  });

  it("importing the same bytes twice adds nothing and says so", () => {
    const db = openDatabaseSync(":memory:");
    const [first] = importFiles(db, [{ name: "a.csv", bytes: wide(["E1", "E2"]) }], opts({ genotype: "wt" }));
    expect(first).toMatchObject({ status: "imported", profilesAdded: 2, embryosAdded: 2 });
    const before = databaseSnapshot(db);
    const [again] = importFiles(db, [{ name: "renamed.csv", bytes: wide(["E1", "E2"]) }], opts({ genotype: "wt" }));
    expect(again.status).toBe("already-imported");
    if (again.status !== "rejected") expect(again.message).toContain("already imported as a.csv");
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("a second channel of the same embryos joins them instead of creating new embryos", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "a.csv", bytes: wide(["E1", "E2"]) }], opts({ genotype: "wt", channel: "glm" }));
    const [r] = importFiles(db, [{ name: "b.csv", bytes: wide(["E1", "E2"], 3) }], opts({ channel: "vellin" }));
    expect(r).toMatchObject({ status: "imported", embryosAdded: 0, embryosMatched: 2, profilesAdded: 2 });
    expect(loadProfiles(db, { embryo: "E1" }).map((p) => [p.channel, p.genotype])).toEqual([["glm", "wt"], ["vellin", "wt"]]);
  });

  it("a genotype conflict with a stored embryo rejects the whole file and leaves the database unchanged", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "a.csv", bytes: wide(["E1", "E2"]) }], opts({ genotype: "wt" }));
    const before = databaseSnapshot(db);
    const [r] = importFiles(db, [{ name: "b.csv", bytes: wide(["E3", "E1"], 1) }], opts({ genotype: "mut", channel: "other" }));
    expect(r.status).toBe("rejected");
    if (r.status === "rejected") {
      expect(r.error.message).toContain('embryo "E1" is already stored with genotype "wt" (from a.csv)');
      expect(r.error.message).toContain("--label-prefix");
    }
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("a profile that is already stored for the same embryo and channel rejects the file", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "a.csv", bytes: wide(["E1"]) }], opts());
    const before = databaseSnapshot(db);
    const [r] = importFiles(db, [{ name: "b.csv", bytes: wide(["E9", "E1"], 2) }], opts());
    expect(r.status).toBe("rejected");
    if (r.status === "rejected") expect(r.error.message).toContain('embryo "E1" already has a stored profile for channel "signal"');
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("deleteImport removes only what that import added", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "a.csv", bytes: wide(["E1"]) }], opts({ genotype: "wt", channel: "glm" }));
    const afterFirst = databaseSnapshot(db);
    importFiles(db, [{ name: "b.csv", bytes: wide(["E1", "E2"], 5) }], opts({ channel: "vellin" }));
    const second = listImports(db)[1];
    expect(second).toMatchObject({ fileName: "b.csv", profiles: 2, embryos: 2 });
    expect(deleteImport(db, second.id)).toEqual({ profiles: 2, embryos: 1, valuesRestored: 0 });
    expect(databaseSnapshot(db).counts).toEqual(afterFirst.counts);
    expect(deleteImport(db, 999)).toBeNull();
  });

  it("openDatabase applies migrations, uses WAL and foreign keys, and keeps a copy before upgrading an older file", async () => {
    const dir = mkdtempSync(join(tmpdir(), "mg-"));
    const path = join(dir, "old.db");
    const old = new Database(path);
    old.exec("CREATE TABLE keepme (v TEXT); INSERT INTO keepme VALUES ('precious');");
    old.pragma("user_version = 0");
    old.close();
    const fresh = await openDatabase(path);
    expect(fresh.migrated).toEqual(loadMigrations().map((m) => m.version));
    expect(fresh.db.pragma("journal_mode", { simple: true })).toBe("wal");
    expect(fresh.db.pragma("foreign_keys", { simple: true })).toBe(1);
    expect(fresh.db.prepare("SELECT v FROM keepme").get()).toEqual({ v: "precious" });
    fresh.db.close();
    const again = await openDatabase(path);
    expect(again.migrated).toEqual([]);
    again.db.pragma("user_version = 99");
    again.db.close();
    await expect(openDatabase(path)).rejects.toThrow(/newer morphogauge/);
  });

  it("openDatabase copies an older database aside before applying a newer migration", async () => {
    const dir = mkdtempSync(join(tmpdir(), "mg-"));
    const path = join(dir, "v1.db");
    const v1 = await openDatabase(path);
    importFiles(v1.db, [{ name: "a.csv", bytes: wide(["E1"]) }], opts());
    v1.db.close();
    const current = loadMigrations().at(-1)!.version;
    const version = current + 1;
    const next = [...loadMigrations(), { version, name: `${String(version).padStart(3, "0")}_test.sql`, sql: "ALTER TABLE embryos ADD COLUMN note TEXT;" }];
    const v2 = await openDatabase(path, next);
    expect(v2.migrated).toEqual([version]);
    expect(v2.backupPath).toBe(`${path}.before-schema-${version}`);
    v2.db.close();
    const copy = new Database(`${path}.before-schema-${version}`, { readonly: true });
    expect(copy.pragma("user_version", { simple: true })).toBe(current);
    expect(copy.prepare("SELECT COUNT(*) AS n FROM profiles").get()).toEqual({ n: 1 });
    copy.close();
  });
});

describe("import report wording", () => {
  it("importFiles says when a file's embryos were already stored and which channel they gained", () => {
    const db = openDatabaseSync(":memory:");
    importFiles(db, [{ name: "a.csv", bytes: wide(["E1", "E2"]) }], opts({ genotype: "wt", channel: "glm" }));
    const [r] = importFiles(db, [{ name: "b.csv", bytes: wide(["E1", "E2"], 3) }], opts());
    expect(r.status).toBe("imported");
    if (r.status === "imported") expect(r.message).toContain('2 embryos were already stored under the same label and gained profiles of channel "signal"');
    const [fresh] = importFiles(db, [{ name: "c.csv", bytes: wide(["E7"]) }], opts());
    if (fresh.status === "imported") expect(fresh.message).not.toContain("already stored");
  });
});
