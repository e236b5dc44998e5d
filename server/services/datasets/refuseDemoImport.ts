import type { Db } from "../../../db/connection.ts";
import { getDatasetKind } from "../../../db/datasetKind.ts";
import { UserError } from "../../userError.ts";

/**
 * The demo database holds only the invented demo: a lab's files go into the
 * lab's own database, so that its embryos never join the demo's groups.
 */
export function refuseDemoImport(db: Db, how: "page" | "cli", env: NodeJS.ProcessEnv = {}): void {
  if (getDatasetKind(db) !== "demo") return;
  throw new UserError(
    "demo-is-open",
    how === "page"
      ? "The invented demo data set is open. Your files go into your own data set: switch to it (or create a new one) at the top of the page, then import. Nothing was imported."
      : `This database holds the invented demo data; your files go into your own database (--db PATH, default ./morphogauge.db)${env.MORPHOGAUGE_DB ? `, and $MORPHOGAUGE_DB names the demo's file: unset it or pass --db` : ""}. Nothing was imported.`,
    { status: 409 },
  );
}
