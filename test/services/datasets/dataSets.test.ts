import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { openDatabase } from "../../../db/connection.ts";
import { getDatasetKind } from "../../../db/datasetKind.ts";
import { ImportOptions } from "../../../server/import/importOptions.ts";
import { DataSets } from "../../../server/services/datasets/dataSets.ts";
import { importFiles } from "../../../server/services/importFiles.ts";

// The demo and the lab's data never share a file (common practice, no source).
const file = { name: "lab.csv", bytes: new TextEncoder().encode("position [µm],L1\n0,9\n10,8\n20,7\n30,6\n40,5\n") };

describe("DataSets", () => {
  it("a file holding the lab's imports is never opened as the demo, and stays unchanged", async () => {
    const dir = mkdtempSync(join(tmpdir(), "mg-ds-"));
    const lab = await openDatabase(join(dir, "mine.db"));
    importFiles(lab.db, [file], ImportOptions.parse({}));
    lab.db.close();
    await expect(DataSets.open({ userPath: join(dir, "x.db"), demoPath: join(dir, "mine.db"), start: "demo" })).rejects.toThrow("holds imports that are not the demo's");
    const again = await openDatabase(join(dir, "mine.db"));
    expect(getDatasetKind(again.db)).toBe("user");
    expect((again.db.prepare("SELECT COUNT(*) AS n FROM imports").get() as { n: number }).n).toBe(1);
    again.db.close();
  });

  it("when $MORPHOGAUGE_DB names the demo's file (as after the README tour) the demo is listed once and opened as the demo", async () => {
    const dir = mkdtempSync(join(tmpdir(), "mg-ds-"));
    const same = join(dir, "morphogauge-demo.db");
    const sets = await DataSets.open({ userPath: same, demoPath: same, start: "user" });
    try {
      expect(sets.list().map((d) => [d.id, d.kind])).toEqual([["demo", "demo"]]);
      expect(sets.current()).toMatchObject({ id: "demo", kind: "demo" });
      expect(getDatasetKind(sets.db)).toBe("demo");
    } finally {
      sets.close();
    }
  }, 60_000);

  it("a new data set is created empty and marked as the lab's; a database not made by morphogauge is not listed", async () => {
    const dir = mkdtempSync(join(tmpdir(), "mg-ds-"));
    const sets = await DataSets.open({ userPath: join(dir, "morphogauge.db"), demoPath: join(dir, "morphogauge-demo.db"), start: "user" });
    try {
      const stray = await openDatabase(join(dir, "stray.db"));
      stray.db.exec("PRAGMA user_version = 0; DROP TABLE dataset;");
      stray.db.close();
      const created = await sets.create("run-2");
      expect(created).toMatchObject({ id: "run-2.db", kind: "user", current: true });
      expect(getDatasetKind(sets.db)).toBe("user");
      expect(sets.list().map((d) => d.id)).toEqual(["demo", "morphogauge.db", "run-2.db"]);
      await expect(sets.create("a/b")).rejects.toThrow("no folders");
    } finally {
      sets.close();
    }
  });
});
