import Database from "better-sqlite3";
import { existsSync, readdirSync } from "node:fs";
import { basename, dirname, join, resolve } from "node:path";
import { openDatabase, type Db } from "../../../db/connection.ts";
import { countImports, getDatasetKind, setDatasetKind, type DatasetKind } from "../../../db/datasetKind.ts";
import { UserError } from "../../userError.ts";
import { loadDemoData } from "../demoData.ts";

/** One database the server can open: the demo, the lab's own file, or another data set of the lab's. */
export interface DataSetEntry {
  /** "demo" for the demo; otherwise the file name. */
  id: string;
  path: string;
  kind: DatasetKind;
  /** Open now: every request of the page goes to it. */
  current: boolean;
  /** False for the lab's file before anything was stored in it. */
  exists: boolean;
}

export interface DataSetsConfig {
  /** The lab's own database (--db, $MORPHOGAUGE_DB or ./morphogauge.db); new data sets are created beside it. */
  userPath: string;
  /** Where the demo lives ($MORPHOGAUGE_DEMO_DB or ./morphogauge-demo.db). */
  demoPath: string;
  /** Which one to open first. */
  start: "demo" | "user";
  log?: (message: string) => void;
}

/** Names of new data sets: a file name without folders. */
const NAME = /^[A-Za-z0-9][A-Za-z0-9_-]{0,63}$/;

/**
 * The databases a server can switch between, one open at a time for the page.
 * A database once opened stays open until the server stops, so a job started
 * on one data set stores its result there even after the page switched away.
 */
export class DataSets {
  private readonly opened = new Map<string, Db>();
  private currentPath: string;
  private readonly config: DataSetsConfig;

  private constructor(config: DataSetsConfig) {
    this.config = { ...config, userPath: resolve(config.userPath), demoPath: resolve(config.demoPath) };
    this.currentPath = config.start === "demo" ? this.config.demoPath : this.config.userPath;
  }

  /** Open the first data set (filling the demo when it is new) and return the switcher. */
  static async open(config: DataSetsConfig): Promise<DataSets> {
    const sets = new DataSets(config);
    await sets.openPath(sets.currentPath);
    return sets;
  }

  /** The open database. */
  get db(): Db {
    return this.opened.get(this.currentPath)!;
  }

  current(): DataSetEntry {
    return this.list().find((e) => e.current)!;
  }

  /** The demo, the lab's file, and every other morphogauge database of the lab's in the same folder. */
  list(): DataSetEntry[] {
    const entry = (path: string, kind: DatasetKind, id = basename(path)): DataSetEntry => ({ id, path, kind, current: path === this.currentPath, exists: this.opened.has(path) || existsSync(path) });
    const out = [entry(this.config.demoPath, "demo", "demo")];
    // $MORPHOGAUGE_DB may name the demo's file (the README tour sets it so): then there is no separate file of the lab's yet.
    if (this.config.userPath !== this.config.demoPath) out.push(entry(this.config.userPath, "user"));
    const folder = dirname(this.config.userPath);
    let names: string[] = [];
    try {
      names = readdirSync(folder).filter((f) => f.endsWith(".db")).sort();
    } catch {
      names = [];
    }
    for (const name of names) {
      const path = join(folder, name);
      if (out.some((e) => e.path === path)) continue;
      if (this.kindOnDisk(path) === "user") out.push(entry(path, "user"));
    }
    return out;
  }

  /** Open another data set by its id; the demo is filled the first time it is opened. */
  async switchTo(id: string): Promise<DataSetEntry> {
    const target = this.list().find((e) => e.id === id);
    if (!target) throw new UserError("unknown-data-set", `No data set "${id}" here; the data sets are ${this.list().map((e) => `"${e.id}"`).join(", ")}.`, { status: 404 });
    await this.openPath(target.path);
    this.currentPath = target.path;
    return this.current();
  }

  /** Create a new, empty data set of the lab's beside its own file and open it. */
  async create(name: string): Promise<DataSetEntry> {
    if (!NAME.test(name)) {
      throw new UserError("bad-data-set-name", `"${name}" cannot name a data set: use letters, digits, "-" and "_" (at most 64), no folders.`, { status: 400 });
    }
    const path = join(dirname(this.config.userPath), `${name}.db`);
    if (existsSync(path) || path === this.config.demoPath) throw new UserError("data-set-exists", `A file ${name}.db already exists; choose another name or switch to it.`, { status: 409 });
    await this.openPath(path);
    this.currentPath = path;
    return this.current();
  }

  close(): void {
    for (const db of this.opened.values()) db.close();
    this.opened.clear();
  }

  private async openPath(path: string): Promise<Db> {
    const known = this.opened.get(path);
    if (known) return known;
    const o = await openDatabase(path);
    if (o.backupPath) this.config.log?.(`${path}: database upgraded to schema ${o.migrated.at(-1)}; the previous file was kept as ${o.backupPath}`);
    if (path === this.config.demoPath) {
      if (countImports(o.db) === 0) {
        const reports = loadDemoData(o.db);
        this.config.log?.(`${o.created ? "created" : "filled"} ${path} with the invented demo data (${reports.filter((r) => r.status === "imported").length} files)`);
      } else if (getDatasetKind(o.db) !== "demo") {
        o.db.close();
        throw new UserError("not-the-demo-database", `${path} holds imports that are not the demo's; move it away or set MORPHOGAUGE_DEMO_DB to another file.`, { status: 409 });
      }
    } else if (o.created) setDatasetKind(o.db, "user");
    this.opened.set(path, o.db);
    return o.db;
  }

  /** The kind recorded in a file not opened yet, or null when it is not a morphogauge database. */
  private kindOnDisk(path: string): DatasetKind | null {
    const open = this.opened.get(path);
    if (open) return getDatasetKind(open);
    let db: Database.Database | null = null;
    try {
      db = new Database(path, { readonly: true, fileMustExist: true });
      const row = db.prepare("SELECT kind FROM dataset WHERE id = 1").get() as { kind: DatasetKind } | undefined;
      return row?.kind ?? "user";
    } catch {
      return null;
    } finally {
      db?.close();
    }
  }
}
