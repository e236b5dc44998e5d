import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import type { Db } from "../../db/connection.ts";
import { countImports, getDatasetKind, setDatasetKind } from "../../db/datasetKind.ts";
import { countProfiles } from "../../db/profiles.ts";
import { DEMO_FILES } from "../../fixtures/demoFiles.ts";
import { ImportOptions } from "../import/importOptions.ts";
import { UserError } from "../userError.ts";
import { importFiles, type ImportReport } from "./importFiles.ts";

const FIXTURES = fileURLToPath(new URL("../../fixtures/", import.meta.url));

/**
 * Load the invented demo data set (main genotypes and the dosage series),
 * reversing the one flipped embryo, and mark the database as the demo's. The
 * demo never goes into a database that holds the lab's own imports, so its
 * embryos can never join a lab's groups.
 */
export function loadDemoData(db: Db): ImportReport[] {
  if (getDatasetKind(db) !== "demo" && countImports(db) > 0) {
    throw new UserError(
      "not-the-demo-database",
      "This database holds your own imports; the invented demo data goes into a database of its own (morphogauge demo writes ./morphogauge-demo.db unless you name another, empty file with --db).",
      { status: 409 },
    );
  }
  setDatasetKind(db, "demo");
  const files = [DEMO_FILES.long, DEMO_FILES.dosage].map((name) => ({ name, bytes: readFileSync(FIXTURES + name) }));
  return importFiles(db, files, ImportOptions.parse({ flip: "auto" }));
}

/** True when the database holds no profiles yet. */
export function isEmpty(db: Db): boolean {
  return countProfiles(db) === 0;
}
