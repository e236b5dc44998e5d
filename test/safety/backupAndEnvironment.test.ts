import { execFileSync } from "node:child_process";
import { closeSync, mkdirSync, mkdtempSync, openSync, readFileSync, rmdirSync, writeFileSync, writeSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Database from "better-sqlite3";
import { describe, expect, it } from "vitest";
import { backupDatabase, inspectCopy } from "../../db/backupDatabase.ts";
import { openDatabase } from "../../db/connection.ts";
import { databaseUserError } from "../../db/databaseError.ts";
import { listImports } from "../../db/imports.ts";
import { ImportOptions } from "../../server/import/importOptions.ts";
import { importFiles } from "../../server/services/importFiles.ts";
import { runCliInProcess } from "../helpers/runCliInProcess.ts";

// Backups must hold every committed change; damaged or unwritable databases are the user's environment, not a bug (common practice, no source).
const enc = (s: string) => new TextEncoder().encode(s);
const wide = (label: string, k: number) => enc(`position [µm],${label}\n${[0, 1, 2, 3, 4, 5].map((i) => `${i * 10},${100 - i * 7 + k}`).join("\n")}\n`);
const tempDir = () => mkdtempSync(join(tmpdir(), "mg-safe-"));

describe("backup and restore", () => {
  it("a backup taken while imports are being written holds every import committed before it, and passes integrity_check", async () => {
    const dir = tempDir();
    const path = join(dir, "live.db");
    const live = await openDatabase(path);
    for (let k = 0; k < 5; k++) importFiles(live.db, [{ name: `a${k}.csv`, bytes: wide(`A${k}`, k) }], ImportOptions.parse({ genotype: "wt" }));
    // The server's connection keeps writing in WAL mode while a second connection (the backup command) copies.
    let k = 5;
    let writing = true;
    const writer = (async () => {
      while (writing) {
        importFiles(live.db, [{ name: `b${k}.csv`, bytes: wide(`B${k}`, k) }], ImportOptions.parse({ genotype: "wt" }));
        k++;
        await new Promise((r) => setImmediate(r));
      }
    })();
    const reader = await openDatabase(path);
    const committedBefore = listImports(reader.db).map((i) => i.fileName);
    const summary = await backupDatabase(reader.db, join(dir, "copy.db"), { force: false });
    writing = false;
    await writer;
    reader.db.close();
    live.db.close();
    const copy = new Database(join(dir, "copy.db"), { readonly: true });
    expect(copy.pragma("integrity_check", { simple: true })).toBe("ok");
    const names = (copy.prepare("SELECT file_name FROM imports").all() as { file_name: string }[]).map((r) => r.file_name);
    copy.close();
    for (const n of committedBefore) expect(names).toContain(n);
    expect(summary.counts.imports).toBe(names.length);
    // A plain copy of the database file alone can miss what is still in the write-ahead log; the backup cannot.
    expect(names.length).toBeGreaterThanOrEqual(5);
  });

  it("backup refuses to overwrite without --force; restore refuses to overwrite without --force and keeps the replaced file", async () => {
    const dir = tempDir();
    const db = join(dir, "lab.db");
    const seeded = await openDatabase(db);
    importFiles(seeded.db, [{ name: "one.csv", bytes: wide("E1", 0) }], ImportOptions.parse({ genotype: "wt" }));
    seeded.db.close();
    const backup = join(dir, "lab.backup");
    expect((await runCliInProcess(["backup", "--db", db, "--out", backup])).code).toBe(0);
    const twice = await runCliInProcess(["backup", "--db", db, "--out", backup]);
    expect(twice.code).toBe(1);
    expect(twice.stderr).toContain("already exists");
    // Change the database after the backup, then restore.
    const later = await openDatabase(db);
    importFiles(later.db, [{ name: "two.csv", bytes: wide("E2", 1) }], ImportOptions.parse({ genotype: "wt" }));
    later.db.close();
    const refused = await runCliInProcess(["restore", backup, "--db", db]);
    expect(refused.code).toBe(1);
    expect(refused.stderr).toContain("add --force");
    const restored = await runCliInProcess(["restore", backup, "--db", db, "--force"]);
    expect(restored.code).toBe(0);
    const back = await openDatabase(db);
    expect(listImports(back.db).map((i) => i.fileName)).toEqual(["one.csv"]);
    back.db.close();
    expect(inspectCopy(`${db}.before-restore`).counts.imports).toBe(2);
    // Restoring into a new place needs no --force.
    expect((await runCliInProcess(["restore", backup, "--db", join(dir, "fresh.db")])).code).toBe(0);
  });

  it("a database with garbled pages is detected when opened, with the backup command in the message", async () => {
    const dir = tempDir();
    const path = join(dir, "garbled.db");
    const o = await openDatabase(path);
    for (let k = 0; k < 20; k++) importFiles(o.db, [{ name: `g${k}.csv`, bytes: wide(`G${k}`, k) }], ImportOptions.parse({ genotype: "wt" }));
    o.db.pragma("wal_checkpoint(TRUNCATE)");
    o.db.close();
    const size = readFileSync(path).length;
    // Overwrite the middle of the file (b-tree pages, not the header) with a pattern.
    const fd = openSync(path, "r+");
    writeSync(fd, Buffer.alloc(8192, 0x5a), 0, 8192, Math.floor(size / 2 / 4096) * 4096);
    closeSync(fd);
    const r = await runCliInProcess(["list", "--db", path]);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain("is damaged");
    expect(r.stderr).toContain("morphogauge backup");
  });
});

describe("environment errors are user errors, never exit 70", () => {
  it("a file that is not SQLite, and a truncated database, are named with what to do", async () => {
    const dir = tempDir();
    const text = join(dir, "notes.db");
    writeFileSync(text, "these are my notes, not a database\n".repeat(200));
    const r = await runCliInProcess(["list", "--db", text]);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain(`${text} is not a morphogauge database`);
    const good = join(dir, "good.db");
    const o = await openDatabase(good);
    for (let k = 0; k < 10; k++) importFiles(o.db, [{ name: `t${k}.csv`, bytes: wide(`T${k}`, k) }], ImportOptions.parse({ genotype: "wt" }));
    o.db.pragma("wal_checkpoint(TRUNCATE)");
    o.db.close();
    const truncated = join(dir, "truncated.db");
    writeFileSync(truncated, readFileSync(good).subarray(0, 3 * 4096 + 100));
    const t = await runCliInProcess(["list", "--db", truncated]);
    expect(t.code).toBe(1);
    expect(t.stderr).not.toContain("this is a bug");
    expect(t.stderr).toContain(truncated);
  });

  it("a folder that does not exist is a user error naming the path", async () => {
    const r = await runCliInProcess(["list", "--db", join(tempDir(), "missing-folder", "lab.db")]);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain("missing-folder");
  });

  it("a full database (SQLite's page limit, the same error as a full disk) gives the disk-full message and keeps what was stored", async () => {
    const dir = tempDir();
    const path = join(dir, "small.db");
    const o = await openDatabase(path);
    importFiles(o.db, [{ name: "first.csv", bytes: wide("F1", 0) }], ImportOptions.parse({ genotype: "wt" }));
    const pages = o.db.pragma("page_count", { simple: true }) as number;
    o.db.pragma(`max_page_count = ${pages}`);
    let caught: unknown = null;
    try {
      const big = enc(`position [µm],${Array.from({ length: 300 }, (_, i) => `H${i}`).join(",")}\n${Array.from({ length: 200 }, (_, r) => `${r},${Array.from({ length: 300 }, (_, i) => 100 + i + r).join(",")}`).join("\n")}\n`);
      importFiles(o.db, [{ name: "big.csv", bytes: big }], ImportOptions.parse({ genotype: "wt" }));
    } catch (e) {
      caught = e;
    }
    const mapped = databaseUserError(caught, path);
    expect(mapped?.code).toBe("disk-full");
    expect(mapped?.message).toContain(path);
    expect(listImports(o.db).map((i) => i.fileName)).toEqual(["first.csv"]);
    o.db.close();
  });

  it("a read-only database (opened read-only: as root, file modes do not stop writes) gives the read-only message", async () => {
    const dir = tempDir();
    const path = join(dir, "ro.db");
    (await openDatabase(path)).db.close();
    const ro = new Database(path, { readonly: true });
    let caught: unknown = null;
    try {
      importFiles(ro, [{ name: "x.csv", bytes: wide("R1", 0) }], ImportOptions.parse({ genotype: "wt" }));
    } catch (e) {
      caught = e;
    }
    ro.close();
    expect(databaseUserError(caught, path)?.code).toBe("database-read-only");
  });

  // Full and read-only disks for real, on a small tmpfs: only where mounting is permitted (root in a container that allows it).
  const mountable = (() => {
    try {
      const probe = mkdtempSync(join(tmpdir(), "mg-mnt-"));
      execFileSync("mount", ["-t", "tmpfs", "-o", "size=64k", "tmpfs", probe], { stdio: "ignore" });
      execFileSync("umount", [probe], { stdio: "ignore" });
      rmdirSync(probe);
      return true;
    } catch {
      return false;
    }
  })();

  it.runIf(mountable)("on a 1 MB tmpfs, importing until the disk is full exits 1 with the disk-full message, never 70; on a read-only mount, with the read-only message", async () => {
    const mnt = mkdtempSync(join(tmpdir(), "mg-full-"));
    execFileSync("mount", ["-t", "tmpfs", "-o", "size=1m", "tmpfs", mnt]);
    try {
      const db = join(mnt, "lab.db");
      const file = join(tempDir(), "big.csv");
      let code = 0;
      let stderr = "";
      for (let round = 0; round < 40 && code === 0; round++) {
        writeFileSync(file, `position [µm],${Array.from({ length: 100 }, (_, i) => `R${round}_${i}`).join(",")}\n${Array.from({ length: 150 }, (_, r) => `${r},${Array.from({ length: 100 }, (_, i) => 1000 - r + i * 0.5 + round).join(",")}`).join("\n")}\n`);
        ({ code, stderr } = await runCliInProcess(["import", file, "--db", db, "--genotype", "wt"]));
      }
      expect(code).toBe(1);
      expect(stderr).toContain("the disk is full");
      expect(stderr).not.toContain("this is a bug");
      const ro = mkdtempSync(join(tmpdir(), "mg-ro-"));
      mkdirSync(join(ro, "x"), { recursive: true });
      execFileSync("mount", ["-t", "tmpfs", "-o", "size=1m,ro", "tmpfs", ro]);
      try {
        const r = await runCliInProcess(["demo", "--db", join(ro, "lab.db")]);
        expect(r.code).toBe(1);
        expect(r.stderr).not.toContain("this is a bug");
        expect(r.stderr).toContain("read-only");
      } finally {
        execFileSync("umount", [ro]);
      }
    } finally {
      execFileSync("umount", [mnt]);
    }
  }, 120_000);
});
