import { existsSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { openDatabaseSync } from "../../db/connection.ts";
import { deleteImport } from "../../db/imports.ts";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";
import { runCliInProcess } from "../helpers/runCliInProcess.ts";

// The command line never stores a side file's rows as profiles nor overwrites a stored value
// without being told to (common practice, no source).
function setup() {
  const dir = mkdtempSync(join(tmpdir(), "mg-side-"));
  const file = (name: string, text: string) => {
    writeFileSync(join(dir, name), text);
    return name;
  };
  const db = join(dir, "lab.db");
  const cli = (...args: string[]) => runCliInProcess([...args, "--db", db], {}, dir);
  const snapshot = () => {
    const d = openDatabaseSync(db);
    try {
      return databaseSnapshot(d);
    } finally {
      d.close();
    }
  };
  return { dir, db, file, cli, snapshot };
}

const profiles = (labels: string[], offset = 0) =>
  "position [µm]\t" + labels.join("\t") + "\n" + [0, 1, 2, 3, 4, 5].map((i) => `${i * 10}\t${labels.map((_, k) => 100 - i * 7 + k + offset).join("\t")}`).join("\n") + "\n";

describe("side files on the command line", () => {
  it("import profiles.tsv meta.csv reads the second file as the side file and applies it", async () => {
    const t = setup();
    t.file("profiles.tsv", profiles(["e001", "e002"]));
    t.file("meta.csv", "embryo,genotype,length (µm)\ne001,wt,510\ne002,tardy,495\n");
    const r = await t.cli("import", "profiles.tsv", "meta.csv");
    expect(r.code, r.stderr + r.stdout).toBe(0);
    expect(r.stdout).toContain("meta.csv: read as the side file of profiles.tsv (one row per embryo, no position column)");
    const list = JSON.parse((await t.cli("list", "--json")).stdout).profiles as { embryo: string; genotype: string; length_um: number }[];
    expect(list.map((p) => [p.embryo, p.genotype, p.length_um]).sort()).toEqual([["e001", "wt", 510], ["e002", "tardy", 495]]);
  });

  it("a side file that names none of the file's embryos is refused and nothing is stored", async () => {
    const t = setup();
    t.file("first.tsv", profiles(["k1"]));
    expect((await t.cli("import", "first.tsv")).code).toBe(0);
    const before = t.snapshot();
    t.file("profiles.tsv", profiles(["e001", "e002"]));
    t.file("other-meta.csv", "embryo,genotype\nwt-01,wt\nwt-02,wt\n");
    const r = await t.cli("import", "profiles.tsv", "other-meta.csv");
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('other-meta.csv: the side file names none of the 2 embryos of profiles.tsv (side file: "wt-01", "wt-02"; profiles.tsv: "e001", "e002")');
    expect(t.snapshot()).toEqual(before);
  });

  it("two side files, a side file besides --meta, or a side file alone are refused before the database is opened", async () => {
    const t = setup();
    t.file("profiles.tsv", profiles(["e001"]));
    t.file("m1.csv", "embryo,genotype\ne001,wt\n");
    t.file("m2.csv", "embryo,stage\ne001,S10\n");
    const two = await t.cli("import", "profiles.tsv", "m1.csv", "m2.csv");
    expect(two.code).toBe(1);
    expect(two.stderr).toContain("m1.csv and m2.csv are all side files");
    const besides = await t.cli("import", "profiles.tsv", "m1.csv", "--meta", "m2.csv");
    expect(besides.stderr).toContain("but m2.csv is already given as the side file (--meta)");
    const alone = await t.cli("import", "m1.csv");
    expect(alone.code).toBe(1);
    expect(alone.stderr).toContain('m1.csv is a side file (one row per embryo, columns "embryo", "genotype", no position column), and no profile file was given with it');
    expect(existsSync(t.db)).toBe(false);
  });

  it("a table with no position column is refused naming the columns it has, not as a number it could not read", async () => {
    const t = setup();
    t.file("long.csv", "embryo,A,intensity\n" + [0, 1, 2, 3, 4].map((i) => `e1,${i},${9 - i}`).join("\n") + "\n" + [0, 1, 2, 3, 4].map((i) => `e2,${i},${9 - i}`).join("\n") + "\n");
    const r = await t.cli("import", "long.csv");
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('no position column found (columns seen: "embryo", "A", "intensity")');
    expect(r.stdout).not.toContain("is not a number");
  });
});

describe("import --on-conflict", () => {
  const first = "embryo,genotype,length [µm],position [µm],intensity\n" + [0, 1, 2, 3, 4].map((i) => `wt-01,wt,551,${i * 10},${90 - i}`).join("\n") + "\n";
  const second = "embryo,length [µm],channel,position [µm],intensity\n" + [0, 1, 2, 3, 4].map((i) => `wt-01,471,vellin,${i * 10},${50 - i}`).join("\n") + "\n";
  const lengthOf = (db: string) => {
    const d = openDatabaseSync(db);
    try {
      return (d.prepare("SELECT length_um FROM embryos WHERE label = 'wt-01'").get() as { length_um: number }).length_um;
    } finally {
      d.close();
    }
  };

  it("refuses by default with the list of conflicts and changes nothing; keep and replace do what they say", async () => {
    const t = setup();
    t.file("a.csv", first);
    t.file("b.csv", second);
    expect((await t.cli("import", "a.csv")).code).toBe(0);
    const before = t.snapshot();
    const refused = await t.cli("import", "b.csv");
    expect(refused.code).toBe(1);
    expect(refused.stdout).toContain('embryo "wt-01" is already stored with length (µm) 551 (from a.csv), but this file gives 471');
    expect(refused.stdout).toContain("--on-conflict replace");
    expect(t.snapshot()).toEqual(before);
    const bad = await t.cli("import", "b.csv", "--on-conflict", "overwrite");
    expect(bad.code).toBe(1);
    expect(bad.stderr).toContain('--on-conflict: "overwrite" is not one of refuse, keep, replace');
    const kept = await t.cli("import", "b.csv", "--on-conflict", "keep", "--json");
    expect(kept.code).toBe(0);
    expect(JSON.parse(kept.stdout).files[0].warnings.map((w: { code: string }) => w.code)).toContain("kept-stored-values");
    expect(lengthOf(t.db)).toBe(551);
    const importId = JSON.parse(kept.stdout).files[0].importId;
    const d = openDatabaseSync(t.db);
    expect(deleteImport(d, importId)).toMatchObject({ profiles: 1, valuesRestored: 0 });
    d.close();
    const replaced = await t.cli("import", "b.csv", "--on-conflict", "replace");
    expect(replaced.code).toBe(0);
    expect(replaced.stdout).toContain("replaced the length (µm) of 1 embryo with this file's values");
    expect(lengthOf(t.db)).toBe(471);
  });

  it("a database holding the demo refuses an import, so the lab's embryos never join the demo's groups", async () => {
    const t = setup();
    expect((await t.cli("demo")).code).toBe(0);
    t.file("a.csv", first);
    const before = t.snapshot();
    const r = await t.cli("import", "a.csv");
    expect(r.code).toBe(1);
    expect(r.stderr).toContain("This database holds the invented demo data; your files go into your own database");
    expect(t.snapshot()).toEqual(before);
    const viaEnv = await runCliInProcess(["import", "a.csv"], { MORPHOGAUGE_DB: t.db }, t.dir);
    expect(viaEnv.stderr).toContain("$MORPHOGAUGE_DB names the demo's file: unset it or pass --db");
  });

  it("the demo is never poured into a database that holds the lab's imports", async () => {
    const t = setup();
    t.file("a.csv", first);
    expect((await t.cli("import", "a.csv")).code).toBe(0);
    const before = t.snapshot();
    const r = await t.cli("demo");
    expect(r.code).toBe(1);
    expect(r.stderr).toContain("This database holds your own imports; the invented demo data goes into a database of its own");
    expect(t.snapshot()).toEqual(before);
  });
});

describe("no position column in a large file", () => {
  it("a long table over 256 kB without a position column is refused naming its columns, from its first lines", async () => {
    const t = setup();
    const rows = Array.from({ length: 30_000 }, (_, i) => `e${i % 300},${i},${(i * 7) % 101}`);
    t.file("big.csv", "embryo,A,intensity\n" + rows.join("\n") + "\n");
    const r = await t.cli("import", "big.csv");
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('no position column found (columns seen: "embryo", "A", "intensity")');
  });
});
