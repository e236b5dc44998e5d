import { describe, expect, it } from "vitest";
import { openDatabaseSync, type Db } from "../../../db/connection.ts";
import { deleteImport, listImports } from "../../../db/imports.ts";
import { ImportOptions, type ImportOptionsInput } from "../../../server/import/importOptions.ts";
import { importFiles, type ImportReport } from "../../../server/services/importFiles.ts";
import { previewImports } from "../../../server/services/imports/previewImports.ts";
import type { ConflictChoice } from "../../../server/services/imports/resolveImport.ts";
import { databaseSnapshot } from "../../helpers/databaseSnapshot.ts";

// Storage rules of this project: a stored value is never overwritten or dropped without the user
// choosing it and being told, and deleting an import undoes exactly what it did (common practice, no source).
const enc = (s: string) => new TextEncoder().encode(s);

interface Row {
  label: string;
  genotype?: string;
  stage?: string;
  lengthUm?: number;
}

/** A long table with only the columns the rows use. */
function longFile(name: string, rows: Row[], channel: string, offset = 0) {
  const cols = (["genotype", "stage", "lengthUm"] as const).filter((k) => rows.some((r) => r[k] !== undefined));
  const header = ["embryo", ...cols.map((c) => (c === "lengthUm" ? "length [µm]" : c)), "channel", "position [µm]", "intensity"].join(",");
  const lines = rows.flatMap((r) => [0, 1, 2, 3, 4, 5].map((i) => [r.label, ...cols.map((c) => r[c]), channel, i * 10, 100 - i * 7 + offset].join(",")));
  return { name, bytes: enc([header, ...lines].join("\n") + "\n") };
}

function wideFile(name: string, labels: string[], offset = 0) {
  return { name, bytes: enc(`position [µm],${labels.join(",")}\n${[0, 1, 2, 3, 4, 5].map((i) => `${i * 10},${labels.map((_, k) => 100 - i * 7 + k + offset).join(",")}`).join("\n")}\n`) };
}

const opts = (o: ImportOptionsInput = {}) => ImportOptions.parse(o);
const A = longFile("a.csv", [{ label: "wt-01", genotype: "wt", lengthUm: 551 }, { label: "wt-02", genotype: "wt", lengthUm: 540 }], "glm");
// The same embryos imaged for a second channel; wt-01 was measured 471 µm long this time, and both got a stage.
const B = longFile("b.csv", [{ label: "wt-01", lengthUm: 471, stage: "S11" }, { label: "wt-02", lengthUm: 540, stage: "S11" }], "vellin", 3);

function embryos(db: Db) {
  return db.prepare("SELECT label, genotype, stage, length_um FROM embryos ORDER BY label").all();
}
function importB(db: Db, choice: ConflictChoice, extra: ImportOptionsInput = {}): ImportReport {
  return importFiles(db, [B], opts(extra), undefined, choice)[0];
}
function withA(): Db {
  const db = openDatabaseSync(":memory:");
  expect(importFiles(db, [A], opts())[0].status).toBe("imported");
  return db;
}
function tablesWithoutSequence(db: Db) {
  const { counts } = databaseSnapshot(db);
  delete counts.sqlite_sequence;
  return counts;
}

describe("import preview against the open database", () => {
  it("previewImports lists the stored embryos, what the file would add and each conflicting length, and stores nothing", () => {
    const db = withA();
    const before = databaseSnapshot(db);
    const [p] = previewImports(db, [B], opts(), undefined, "refuse");
    expect(p.status).toBe("conflicts");
    if (p.status === "rejected") return;
    expect(p.database.newEmbryos).toEqual([]);
    expect(p.database.conflicts).toBe(1);
    const wt01 = p.database.stored.find((s) => s.label === "wt-01")!;
    expect(wt01).toMatchObject({ storedFrom: "a.csv", newProfiles: ["vellin"], conflicts: [{ field: "length_um", name: "length (µm)", stored: 551, file: 471 }] });
    expect(wt01.additions).toEqual([{ field: "stage", name: "stage", stored: null, file: "S11" }]);
    expect(p.database.stored.find((s) => s.label === "wt-02")!.conflicts).toEqual([]);
    expect(p.outcome.message).toContain('embryo "wt-01" is already stored with length (µm) 551 (from a.csv), but this file gives 471');
    expect(p.outcome.message).toContain("--on-conflict keep");
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("a second copy of an imported file previews as already imported, and importing it stores nothing", () => {
    const db = withA();
    const before = databaseSnapshot(db);
    const copy = { name: "a copy.csv", bytes: A.bytes };
    const [p] = previewImports(db, [copy], opts(), undefined, "refuse");
    expect(p.status).toBe("already-imported");
    if (p.status !== "rejected") expect(p.outcome.message).toBe("already imported as a.csv (import #1) with the same options and side file; nothing added");
    const [r] = importFiles(db, [copy], opts());
    expect(r.status).toBe("already-imported");
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("with keep or replace chosen the preview is ready and says what the import would change", () => {
    const db = withA();
    const [keep] = previewImports(db, [B], opts(), undefined, "keep");
    expect(keep.status).toBe("ok");
    const [replace] = previewImports(db, [B], opts(), undefined, "replace");
    if (replace.status === "rejected") throw new Error("unexpected rejection");
    expect(replace.outcome.message).toContain("replaced the length (µm) of 1 embryo");
    expect(replace.outcome.message).toContain("filled in the stage of 2 embryos");
  });
});

describe("each conflict choice does what it says", () => {
  it("refuse (the default) imports nothing, lists the conflict, and leaves the database checksum unchanged", () => {
    const db = withA();
    const before = databaseSnapshot(db);
    const r = importB(db, "refuse");
    expect(r.status).toBe("rejected");
    if (r.status !== "rejected") return;
    expect(r.error.code).toBe("import-conflicts");
    expect(r.error.issues).toEqual([{ path: "b.csv", message: 'embryo "wt-01" is already stored with length (µm) 551 (from a.csv), but this file gives 471' }]);
    expect(r.error.message).toContain("Nothing was imported");
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("keep leaves the stored length, adds the new channel and the missing stage, and records the value it did not apply", () => {
    const db = withA();
    const r = importB(db, "keep");
    expect(r).toMatchObject({ status: "imported", profilesAdded: 2, embryosAdded: 0, valuesChanged: 2 });
    expect(embryos(db)).toEqual([
      { label: "wt-01", genotype: "wt", stage: "S11", length_um: 551 },
      { label: "wt-02", genotype: "wt", stage: "S11", length_um: 540 },
    ]);
    const stored = listImports(db)[1];
    const kept = (stored.warnings as { code: string; message: string }[]).find((w) => w.code === "kept-stored-values")!;
    expect(kept.message).toContain('embryo "wt-01" length (µm) 471 (kept 551)');
    expect(stored.settings).toMatchObject({ onConflict: "keep" });
  });

  it("replace takes the file's length and deleting the import puts back exactly the stored values", () => {
    const db = withA();
    const before = embryos(db);
    const countsBefore = tablesWithoutSequence(db);
    const r = importB(db, "replace");
    expect(r).toMatchObject({ status: "imported", valuesChanged: 3 });
    if (r.status === "imported") expect(r.message).toContain("deleting this import puts the stored ones back");
    expect(embryos(db)).toEqual([
      { label: "wt-01", genotype: "wt", stage: "S11", length_um: 471 },
      { label: "wt-02", genotype: "wt", stage: "S11", length_um: 540 },
    ]);
    expect(deleteImport(db, r.status === "imported" ? r.importId! : -1)).toEqual({ profiles: 2, embryos: 0, valuesRestored: 3 });
    expect(embryos(db)).toEqual(before);
    expect(tablesWithoutSequence(db)).toEqual(countsBefore);
  });

  it("a label prefix imports the file's embryos as new ones and leaves the stored ones untouched", () => {
    const db = withA();
    const before = embryos(db);
    const r = importB(db, "refuse", { labelPrefix: "run2-" });
    expect(r).toMatchObject({ status: "imported", embryosAdded: 2, embryosMatched: 0, valuesChanged: 0 });
    expect(embryos(db).filter((e) => !(e as { label: string }).label.startsWith("run2-"))).toEqual(before);
    expect(embryos(db).find((e) => (e as { label: string }).label === "run2-wt-01")).toMatchObject({ length_um: 471 });
  });

  it("a stored profile is never replaced: replace refuses a file with other values for a stored channel; keep leaves it out and says so", () => {
    const db = withA();
    const before = databaseSnapshot(db);
    const other = longFile("c.csv", [{ label: "wt-01" }, { label: "wt-09" }], "glm", 9);
    const [replaced] = importFiles(db, [other], opts(), undefined, "replace");
    expect(replaced.status).toBe("rejected");
    if (replaced.status === "rejected") expect(replaced.error.message).toContain('embryo "wt-01" already has a stored profile for channel "glm" (from a.csv) with other values');
    expect(databaseSnapshot(db)).toEqual(before);
    const [kept] = importFiles(db, [other], opts(), undefined, "keep");
    expect(kept).toMatchObject({ status: "imported", profilesAdded: 1, embryosAdded: 1 });
    if (kept.status === "imported") expect(kept.warnings.map((w) => w.code)).toContain("profiles-not-added");
  });

  it("deleting imports that replaced the same value in turn restores the original, whichever is deleted first", () => {
    for (const order of [[0, 1], [1, 0]]) {
      const db = withA();
      const second = importB(db, "replace");
      const third = importFiles(db, [longFile("d.csv", [{ label: "wt-01", lengthUm: 500 }], "other", 5)], opts(), undefined, "replace")[0];
      const lengthOf = () => (db.prepare("SELECT length_um FROM embryos WHERE label = 'wt-01'").get() as { length_um: number }).length_um;
      expect(lengthOf()).toBe(500);
      const ids = [second, third].map((r) => (r.status === "imported" ? r.importId! : -1));
      deleteImport(db, ids[order[0]]);
      expect(lengthOf()).toBe(order[0] === 0 ? 500 : 471);
      deleteImport(db, ids[order[1]]);
      expect(lengthOf()).toBe(551);
    }
  });
});

describe("re-importing the same bytes", () => {
  it("a corrected side file for the same bytes is a new import that fills in the genotype, and deleting it puts 'unassigned' back", () => {
    const db = openDatabaseSync(":memory:");
    const W = wideFile("w.csv", ["E1", "E2"]);
    importFiles(db, [W], opts());
    const genotypes = () => db.prepare("SELECT genotype FROM embryos ORDER BY label").all().map((r) => (r as { genotype: string }).genotype);
    expect(genotypes()).toEqual(["unassigned", "unassigned"]);
    const meta = { name: "w-meta.csv", bytes: enc("embryo,genotype\nE1,wt\nE2,wt\n") };
    const [r] = importFiles(db, [W], opts(), meta);
    expect(r).toMatchObject({ status: "imported", profilesAdded: 0, valuesChanged: 2 });
    if (r.status === "imported") expect(r.message).toContain("these bytes were imported before as #1 (w.csv); this is a new import because no side file then, w-meta.csv now");
    expect(genotypes()).toEqual(["wt", "wt"]);
    deleteImport(db, r.status === "imported" ? r.importId! : -1);
    expect(genotypes()).toEqual(["unassigned", "unassigned"]);
    expect(listImports(db)).toHaveLength(1);
  });

  it("the same bytes under another channel or label prefix are a new import; with nothing new the message says precisely why", () => {
    const db = openDatabaseSync(":memory:");
    const W = wideFile("w.csv", ["E1", "E2"]);
    expect(importFiles(db, [W], opts({ genotype: "wt", channel: "glm" }))[0].status).toBe("imported");
    expect(importFiles(db, [W], opts({ genotype: "wt", channel: "vellin" }))[0]).toMatchObject({ status: "imported", profilesAdded: 2, embryosAdded: 0 });
    expect(importFiles(db, [W], opts({ genotype: "wt", channel: "glm", labelPrefix: "b-" }))[0]).toMatchObject({ status: "imported", embryosAdded: 2 });
    const before = databaseSnapshot(db);
    const [same] = importFiles(db, [W], opts({ channel: "glm" }));
    expect(same.status).toBe("already-imported");
    if (same.status !== "rejected") {
      expect(same.message).toContain("nothing added: every profile of this file is already stored unchanged");
      expect(same.message).toContain('import #1 of w.csv: genotype "wt" then, (none) now');
    }
    expect(databaseSnapshot(db)).toEqual(before);
  });
});
