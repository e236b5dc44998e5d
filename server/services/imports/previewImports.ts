import type { Db } from "../../../db/connection.ts";
import type { ResolvedImportOptions } from "../../import/importOptions.ts";
import type { SourceFile } from "../../import/parseProfileFile.ts";
import type { DroppedCell, ImportWarning } from "../../import/records.ts";
import { isUserError, type UserIssue } from "../../userError.ts";
import { importSettings } from "../importFiles.ts";
import { parseForImport } from "./parseForImport.ts";
import { planImport, type ImportPlan } from "./planImport.ts";
import { resolveImport, type ConflictChoice } from "./resolveImport.ts";

export interface PreviewEmbryo {
  label: string;
  genotype: string;
  lengthUm: number | null;
  profiles: { channel: string; timeS: number | null; points: number; positionUnit: string; flipped: boolean }[];
}

export type PreviewFile =
  | {
      file: string;
      /**
       * ok: importing would store what `outcome` says; conflicts: values differ from stored
       * embryos and a choice is needed; already-imported: importing would store nothing (`outcome` says why).
       */
      status: "ok" | "conflicts" | "already-imported";
      format: string;
      delimiter: string;
      decimalMark: string;
      columns: { header: string; role: string; unit: string | null }[];
      embryos: PreviewEmbryo[];
      warnings: ImportWarning[];
      droppedCells: DroppedCell[];
      /** The comparison with the open database. */
      database: Omit<ImportPlan, "stored"> & { stored: Omit<ImportPlan["stored"][number], "embryoId">[] };
      /** What importing with the chosen conflict handling would do, or the conflicts to choose for. */
      outcome: { message: string; issues: UserIssue[] };
    }
  | { file: string; status: "rejected"; error: { code: string; message: string; issues: UserIssue[] } };

/**
 * Everything an import would do, nothing stored: what the parser read, how the
 * file compares with the open database (embryos already stored, what would be
 * added, conflicts), and what the chosen conflict handling would store.
 */
export function previewImports(db: Db, files: SourceFile[], options: ResolvedImportOptions, meta: SourceFile | undefined, onConflict: ConflictChoice): PreviewFile[] {
  return files.map((f): PreviewFile => {
    try {
      const p = parseForImport(f, options, meta);
      const settings = importSettings(options, meta);
      const plan = planImport(db, p, settings);
      let status: "ok" | "conflicts" | "already-imported" = "ok";
      let outcome: { message: string; issues: UserIssue[] };
      try {
        const r = resolveImport(p, plan, onConflict, settings);
        if (r.kind === "nothing-new") {
          status = "already-imported";
          outcome = { message: r.message, issues: [] };
        } else {
          const n = r.toStore.profiles.length;
          outcome = { message: [`would add ${n} profile${n === 1 ? "" : "s"} and ${r.toStore.newEmbryos.length} new embryo${r.toStore.newEmbryos.length === 1 ? "" : "s"}`, ...r.notes].join("; "), issues: [] };
        }
      } catch (e) {
        if (!isUserError(e)) throw e;
        if (e.code !== "import-conflicts") throw e;
        status = "conflicts";
        outcome = { message: e.message, issues: e.issues };
      }
      return {
        file: f.name,
        status,
        format: p.format,
        delimiter: p.delimiter,
        decimalMark: p.decimalMark,
        columns: p.columns,
        embryos: p.embryos.map((e) => ({
          label: e.label,
          genotype: e.genotype,
          lengthUm: e.lengthUm,
          profiles: p.profiles.filter((x) => x.embryo === e.label).map((x) => ({ channel: x.channel, timeS: x.timeS, points: x.positionsUm.length, positionUnit: x.positionUnit, flipped: x.flipped })),
        })),
        warnings: p.warnings,
        droppedCells: p.droppedCells.slice(0, 100),
        database: { ...plan, stored: plan.stored.map(({ embryoId: _id, ...rest }) => rest) },
        outcome,
      };
    } catch (e) {
      if (!isUserError(e)) throw e;
      return { file: f.name, status: "rejected", error: { code: e.code, message: e.message, issues: e.issues } };
    }
  });
}
