import { readFileSync, statSync } from "node:fs";
import { basename, resolve } from "node:path";
import { ImportOptions } from "../import/importOptions.ts";
import type { SourceFile } from "../import/parseProfileFile.ts";
import { refuseDemoImport } from "../services/datasets/refuseDemoImport.ts";
import { importFiles } from "../services/importFiles.ts";
import { CONFLICT_CHOICES, type ConflictChoice } from "../services/imports/resolveImport.ts";
import { sortSourceFiles } from "../services/imports/sortSourceFiles.ts";
import { UserError } from "../userError.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { zodToUserError } from "./zodToUserError.ts";

export const importCommand: Command = {
  name: "import",
  summary: "import profile exports (CSV/TSV, long or wide) into the database",
  allowPositionals: true,
  help: `Usage: morphogauge import FILE... [SIDEFILE] [options]

Imports each file in one transaction: all of it or nothing. Shapes (detected from the header):
  long   one row per point: embryo, position, intensity [, genotype, channel, age, length, time…]
  wide   first column position, then one column per embryo (header = label)
A file with one row per embryo and no position column is the side file of the
others (the same as --meta).

Each file is compared with the database first. Embryos already stored under
the same label are the same embryos (a new channel joins them; values they
lack are filled in). Where the file gives a value other than the stored one
(length, genotype, stage…) or another profile for the same channel:
  --on-conflict refuse   import nothing and list the conflicts (default)
  --on-conflict keep     keep the stored values; the file's are listed, not applied
  --on-conflict replace  take the file's values (deleting the import puts the stored ones back)
  --label-prefix P       or import the file's embryos as new ones, labelled P + label
The same bytes with the same options and side file add nothing; with other
options (another channel, prefix or a corrected side file) they are a new import.

  --meta FILE            side file with one row per embryo (genotype, stage, age, length, dosage…)
  --genotype G           genotype of embryos the files do not assign one
  --channel C            channel (target) name when the file has no channel column (default: signal)
  --pixel-size UM        µm per pixel, for positions in pixels
  --length UM            embryo length in µm, for embryos with none in the files
  --position-unit U      um | px | fraction, when the position header names no unit
  --label-prefix P       put P before every embryo label (keeps "1, 2, 3…" of two files apart)
  --flip auto|none       auto: reverse profiles that rise away from the source (default none: warn)
  --format auto|long|wide
  --delimiter auto|comma|semicolon|tab
  --decimal auto|point|comma
  --max-bytes N          largest file accepted (default 52428800)
  --max-embryos N        most embryos per file (default 5000)
${COMMON_HELP}`,
  options: {
    ...COMMON_OPTIONS,
    meta: { type: "string" },
    genotype: { type: "string" },
    channel: { type: "string" },
    "pixel-size": { type: "string" },
    length: { type: "string" },
    "position-unit": { type: "string" },
    "label-prefix": { type: "string" },
    flip: { type: "string" },
    format: { type: "string" },
    delimiter: { type: "string" },
    decimal: { type: "string" },
    "max-bytes": { type: "string" },
    "max-embryos": { type: "string" },
    "on-conflict": { type: "string" },
  },
  async run(values, positionals, io) {
    if (positionals.length === 0) throw new UserError("no-files", "name at least one file to import (morphogauge import FILE...)");
    const delimiters: Record<string, string> = { auto: "auto", comma: ",", semicolon: ";", tab: "\t", ",": ",", ";": ";" };
    const decimals: Record<string, string> = { auto: "auto", point: ".", comma: ",", ".": ".", ",": "," };
    const parsed = ImportOptions.safeParse({
      format: values.format,
      delimiter: values.delimiter === undefined ? undefined : (delimiters[values.delimiter as string] ?? values.delimiter),
      decimalMark: values.decimal === undefined ? undefined : (decimals[values.decimal as string] ?? values.decimal),
      positionUnit: values["position-unit"],
      pixelSizeUm: numberOption("pixel-size", values["pixel-size"] as string | undefined),
      lengthUm: numberOption("length", values.length as string | undefined),
      genotype: values.genotype,
      channel: values.channel,
      labelPrefix: values["label-prefix"],
      flip: values.flip,
      maxBytes: numberOption("max-bytes", values["max-bytes"] as string | undefined),
      maxEmbryos: numberOption("max-embryos", values["max-embryos"] as string | undefined),
    });
    if (!parsed.success) throw zodToUserError(parsed.error, { decimalMark: "decimal", positionUnit: "position-unit", pixelSizeUm: "pixel-size", lengthUm: "length", labelPrefix: "label-prefix", maxBytes: "max-bytes", maxEmbryos: "max-embryos" });
    const read = (path: string): SourceFile => {
      const full = resolve(io.cwd, path);
      let size: number;
      try {
        size = statSync(full).size;
      } catch {
        throw new UserError("file-not-found", `${path}: no such file`);
      }
      if (size > parsed.data.maxBytes) throw new UserError("file-too-large", `${path}: the file is ${size} bytes, over the ${parsed.data.maxBytes}-byte limit (raise it with --max-bytes). Nothing was imported.`);
      return { name: basename(path), bytes: readFileSync(full) };
    };
    const onConflict = (values["on-conflict"] ?? "refuse") as ConflictChoice;
    if (!CONFLICT_CHOICES.includes(onConflict)) throw new UserError("bad-option", `--on-conflict: "${onConflict}" is not one of ${CONFLICT_CHOICES.join(", ")}`);
    const given = positionals.map(read);
    const sorted = sortSourceFiles(given, values.meta === undefined ? undefined : read(values.meta as string), parsed.data);
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      refuseDemoImport(db, "cli", values.db === undefined ? io.env : {});
      const reports = importFiles(db, sorted.profiles, parsed.data, sorted.meta, onConflict);
      if (values.json) io.stdout(JSON.stringify({ files: reports, notes: sorted.notes }, null, 2) + "\n");
      else {
        for (const n of sorted.notes) io.stdout(`· ${n}\n`);
        for (const r of reports) {
          if (r.status === "rejected") {
            io.stdout(`✗ ${r.file}: rejected\n  ${r.error.message}\n`);
            for (const i of r.error.issues.slice(1, 50)) io.stdout(`  - ${i.path}: ${i.message}\n`);
            if (r.error.issues.length > 50) io.stdout(`  … and ${r.error.issues.length - 50} more\n`);
            continue;
          }
          io.stdout(`✓ ${r.file}: ${r.message}\n`);
          for (const w of r.warnings) io.stdout(`  ! ${w.message}\n    → ${w.hint}\n`);
        }
      }
      return reports.some((r) => r.status === "rejected") ? 1 : 0;
    } finally {
      db.close();
    }
  },
};
