import type { Db } from "../../../db/connection.ts";
import { UserError } from "../../userError.ts";
import { analysisResponse } from "../analyses/analysisResponse.ts";
import { fileNamePart } from "../figures/fileNamePart.ts";
import { precisionChannel } from "../precision/precisionChannel.ts";
import { comparisonTable } from "./comparisonTable.ts";
import { csvText } from "./csvText.ts";
import { fitTable } from "./fitTable.ts";
import { planTable } from "./planTable.ts";
import { precisionTable } from "./precisionTable.ts";
import { trackingTable } from "./trackingTable.ts";
import { inputsTable } from "./inputsTable.ts";

export const EXPORT_TABLES = ["fits", "precision", "comparison", "tracking", "plan", "inputs"] as const;
export type ExportTable = (typeof EXPORT_TABLES)[number];

export interface TableRequest {
  table: ExportTable;
  /** Stored analysis id (every table but fits). */
  analysis?: number;
  /** Channel of a multi-channel precision analysis; for fits, a filter. */
  channel?: string;
  /** Filters of the fit table. */
  genotype?: string;
  model?: string;
}

/** A table as CSV text with a meaningful file name: the fit table of the whole database (or a filter), or one stored analysis's table. */
export function storedTable(db: Db, request: TableRequest): { csv: string; fileName: string } {
  const { table } = request;
  if (table === "fits") {
    const filters = [request.genotype, request.channel, request.model].filter((v): v is string => v !== undefined);
    return { csv: csvText(fitTable(db, { genotype: request.genotype, channel: request.channel, model: request.model })), fileName: ["fits", ...filters].map(fileNamePart).join("_") + ".csv" };
  }
  if (request.analysis === undefined) throw new UserError("missing-analysis", `The ${table} table is read from a stored analysis: give analysis=ID.`, { status: 400, issues: [{ path: "query.analysis", message: "required for this table" }] });
  const id = request.analysis;
  const use = `the ${table} table`;
  const name = (label: string) => [table, label, `analysis${id}`].map(fileNamePart).join("_") + ".csv";
  switch (table) {
    case "precision": {
      const p = precisionChannel(analysisResponse(db, id, "precision", use), request.channel);
      return { csv: csvText(precisionTable(p)), fileName: name(`${p.group}_${p.channel}`) };
    }
    case "comparison": {
      const c = analysisResponse(db, id, "comparison", use);
      return { csv: csvText(comparisonTable(c)), fileName: name(`${c.metric}-by-${c.by}_${c.channel}`) };
    }
    case "tracking": {
      const t = analysisResponse(db, id, "tracking", use);
      return { csv: csvText(trackingTable(t)), fileName: name(`${t.over}_${t.channel}`) };
    }
    case "inputs":
      return { csv: csvText(inputsTable(db, id)), fileName: name("profiles-fits-left-out") };
    case "plan": {
      const p = analysisResponse(db, id, "plan", use);
      return { csv: csvText(planTable(p)), fileName: name(`${p.metric}${p.group ? `_${p.group}` : ""}`) };
    }
  }
}
