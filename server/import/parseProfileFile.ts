import { createHash } from "node:crypto";
import { classifyHeaders, type ColumnHeader } from "./columnRoles.ts";
import { decodeChunks, decodeText } from "./decodeText.ts";
import { collectRows, openDelimitedTable, type TableStream } from "./delimitedTable.ts";
import { ImportError, IssueCollector } from "./importError.ts";
import type { ResolvedImportOptions } from "./importOptions.ts";
import { looksLikeDecimalComma } from "./numericCell.ts";
import { parseLongTable } from "./parseLongTable.ts";
import { parseMetadataTable } from "./parseMetadataTable.ts";
import { parseWideTable } from "./parseWideTable.ts";
import { checkProfile, risesAwayFromSource, warnAboutProfile } from "./profileChecks.ts";
import type { RawEmbryoAttributes, RawProfile } from "./rawTables.ts";
import type { DroppedCell, EmbryoRecord, ParsedImport, PositionUnit, ProfileRecord, TableFormat } from "./records.ts";
import { KNOWN_LENGTH_UNITS, lengthUnit } from "./units.ts";
import { listEmbryos, WarningCollector } from "./warningCollector.ts";

export interface SourceFile {
  name: string;
  bytes: Uint8Array;
}

export const UNASSIGNED_GENOTYPE = "unassigned";

/**
 * Parse one exported profile table (and optionally its metadata side file)
 * into validated records. Nothing is stored here; every problem found is
 * thrown together as one ImportError naming file, row and column.
 */
export function parseProfileFile(data: SourceFile, options: ResolvedImportOptions, meta?: SourceFile): ParsedImport {
  const file = data.name;
  if (data.bytes.length > options.maxBytes) {
    throw new ImportError([{ location: { file }, message: `the file is ${formatBytes(data.bytes.length)}, over the ${formatBytes(options.maxBytes)} limit (raise it with --max-bytes)` }]);
  }
  if (meta && meta.bytes.length > options.maxBytes) {
    throw new ImportError([{ location: { file: meta.name }, message: `the side file is ${formatBytes(meta.bytes.length)}, over the ${formatBytes(options.maxBytes)} limit` }]);
  }
  const issues = new IssueCollector();
  const warnings = new WarningCollector();
  const dropped: DroppedCell[] = [];

  // One pass over the text: rows stream from the tokenizer into the table
  // reader, and only each profile's numbers are kept. A semicolon or tab file
  // with an automatic decimal mark is first scanned for decimal commas.
  const pieces = decodeChunks(data.bytes, file);
  const table = openDelimitedTable(pieces, file, options.delimiter);
  const decimalMark =
    options.decimalMark !== "auto"
      ? options.decimalMark
      : table.delimiter !== "," && hasDecimalComma(openDelimitedTable(pieces, file, table.delimiter))
        ? ","
        : ".";
  if (decimalMark === "," && table.delimiter === ",") {
    issues.add({ file }, "a comma cannot be both the separator and the decimal mark; export with semicolons or tabs between columns");
    issues.throwIfAny();
  }
  const columns = classifyHeaders(table.header.cells);
  const format = chooseFormat(columns, options.format, file, table.header.line);

  const parsed =
    format === "long"
      ? parseLongTable(table, columns, { file, decimalMark, labelPrefix: options.labelPrefix, issues, warnings, dropped })
      : parseWideTable(collectRows(table), columns, { file, decimalMark, labelPrefix: options.labelPrefix, issues, dropped });
  issues.throwIfAny();

  const metaAttributes = meta
    ? parseMetadataTable(decodeText(meta.bytes, meta.name), meta.name, { delimiter: options.delimiter, decimalMark: options.decimalMark, labelPrefix: options.labelPrefix }, warnings)
    : null;

  const labels = [...new Set(parsed.profiles.map((p) => p.embryo))];
  if (labels.length > options.maxEmbryos) {
    issues.add({ file }, `the file has ${labels.length} embryos, more than the limit of ${options.maxEmbryos} (raise it with --max-embryos)`);
    issues.throwIfAny();
  }

  const embryos = labels.map((label) => mergeEmbryo(label, parsed.attributes.get(label), metaAttributes?.get(label), meta?.name ?? null, options, file, issues));
  if (metaAttributes) {
    const missing = labels.filter((l) => !metaAttributes.has(l));
    if (missing.length > 0) {
      warnings.add("meta-missing", null, () => `${missing.length} embryo${missing.length > 1 ? "s are" : " is"} not in the side file (${listEmbryos(missing)})`, "add a row for each embryo to the side file");
    }
    const unmatched = [...metaAttributes.keys()].filter((l) => !labels.includes(l));
    if (unmatched.length > 0) {
      warnings.add("meta-unmatched", null, () => `${unmatched.length} side-file row${unmatched.length > 1 ? "s name embryos" : " names an embryo"} not in the data file (${listEmbryos(unmatched)})`, "check the labels match the data file's headers exactly");
    }
  }

  const positionColumn = format === "long" ? columns.find((c) => c.role === "position")! : columns[0];
  const unit = resolvePositionUnit(positionColumn, options, file, issues, warnings, parsed.profiles);
  issues.throwIfAny();

  const embryoByLabel = new Map(embryos.map((e) => [e.record.label, e]));
  const profiles: ProfileRecord[] = [];
  for (const raw of parsed.profiles) {
    const channel = raw.channel ?? options.channel;
    checkProfile(raw, channel, file, issues);
    if (issues.count > 0) continue;
    const emb = embryoByLabel.get(raw.embryo)!;
    const pixelSizeUm = emb.pixelSizeUm ?? options.pixelSizeUm ?? null;
    if (unit.unit === "px" && pixelSizeUm === null) {
      issues.add({ file, column: positionColumn.header }, `positions are in pixels, so a pixel size is needed (give --pixel-size in µm, or a "pixel size" column in the side file) — embryo "${raw.embryo}"`);
      continue;
    }
    const lengthUm = emb.record.lengthUm;
    if (unit.unit === "fraction" && lengthUm === null) {
      issues.add({ file, column: positionColumn.header }, `positions are fractions of length, so the embryo length is needed to convert them to µm (give --length in µm or a length column) — embryo "${raw.embryo}"`);
      continue;
    }
    warnAboutProfile(raw, warnings, options.flip === "auto");
    profiles.push(toRecord(raw, channel, unit, pixelSizeUm, lengthUm, options.flip === "auto" && risesAwayFromSource(raw.intensities)));
    // The record holds the numbers now; let the parsed lists go, so a large file is not held twice.
    raw.positions = [];
    raw.intensities = [];
    raw.rows = [];
  }
  for (const e of embryos) {
    if (e.lengthFromPixels !== null) {
      const px = e.pixelSizeUm ?? options.pixelSizeUm;
      if (px === undefined || px === null) issues.add({ file }, `embryo "${e.record.label}": its length is in pixels, so a pixel size is needed (--pixel-size in µm)`);
      else e.record.lengthUm = e.lengthFromPixels * px;
    }
  }
  issues.throwIfAny();

  if (dropped.length > 0) {
    const rows = [...new Set(dropped.map((d) => d.row))];
    warnings.add(
      "missing-cells",
      null,
      () => `${dropped.length} empty, NaN or NA cell${dropped.length > 1 ? "s were" : " was"} dropped (row${rows.length > 1 ? "s" : ""} ${rows.slice(0, 10).join(", ")}${rows.length > 10 ? ", …" : ""}); no value was replaced by 0`,
      "fill the gaps in the export if they are not real missing values",
    );
  }

  return {
    fileName: file,
    sha256: createHash("sha256").update(data.bytes).digest("hex"),
    byteSize: data.bytes.length,
    format,
    delimiter: table.delimiter,
    decimalMark,
    metaFileName: meta?.name ?? null,
    metaSha256: meta ? createHash("sha256").update(meta.bytes).digest("hex") : null,
    embryos: embryos.map((e) => e.record),
    profiles,
    warnings: warnings.list(),
    droppedCells: dropped,
    columns: columns.map((c) => ({
      header: c.header,
      role: format === "wide" ? (c.index === 0 ? "position" : "embryo intensity") : c.role,
      unit: c.unitText,
    })),
  };
}

/** True when some data cell reads as a decimal-comma number ("12,5"); stops at the first. */
function hasDecimalComma(table: TableStream): boolean {
  let found = false;
  table.forEachRow((row) => {
    found = looksLikeDecimalComma(row.cells);
    return !found;
  });
  return found;
}

function chooseFormat(columns: ColumnHeader[], option: "auto" | TableFormat, file: string, headerLine: number): TableFormat {
  const has = (role: string) => columns.some((c) => c.role === role);
  const longReady = has("embryo") && has("position") && has("intensity");
  if (option === "long" && !longReady) {
    const missing = ["embryo", "position", "intensity"].filter((r) => !has(r));
    throw new ImportError([
      { location: { file, row: headerLine }, message: `a long table needs columns for embryo, position and intensity; no column is recognised as ${missing.join(" or ")} (found: ${columns.map((c) => `"${c.header}"`).join(", ")})` },
    ]);
  }
  if (option !== "auto") return option;
  return longReady ? "long" : "wide";
}

interface MergedEmbryo {
  record: EmbryoRecord;
  pixelSizeUm: number | null;
  /** A length given in pixels, converted once the pixel size is known. */
  lengthFromPixels: number | null;
}

function mergeEmbryo(
  label: string,
  fromData: RawEmbryoAttributes | undefined,
  fromMeta: RawEmbryoAttributes | undefined,
  metaName: string | null,
  options: ResolvedImportOptions,
  file: string,
  issues: IssueCollector,
): MergedEmbryo {
  const pick = <K extends keyof RawEmbryoAttributes>(key: K, what: string): RawEmbryoAttributes[K] | undefined => {
    const a = fromData?.[key];
    const b = fromMeta?.[key];
    if (a !== undefined && b !== undefined && JSON.stringify(a) !== JSON.stringify(b)) {
      issues.add({ file: metaName ?? file }, `embryo "${label}" has ${what} ${show(b)} in the side file but ${show(a)} in ${file}`);
    }
    return a ?? b;
  };
  let genotype = pick("genotype", "genotype");
  if (genotype !== undefined && options.genotype !== undefined && genotype !== options.genotype) {
    issues.add({ file }, `embryo "${label}" has genotype "${genotype}" in the file, but --genotype says "${options.genotype}"; drop one of them`);
  }
  genotype = genotype ?? options.genotype ?? UNASSIGNED_GENOTYPE;
  const length = pick("length", "length");
  const pixelSizeUm = pick("pixelSizeUm", "pixel size") ?? null;
  return {
    record: {
      label,
      genotype,
      stage: pick("stage", "stage") ?? null,
      ageS: pick("ageS", "age") ?? null,
      lengthUm: length?.unit === "um" ? length.value : length === undefined ? (options.lengthUm ?? null) : null,
      dosage: pick("dosage", "dosage") ?? null,
      session: pick("session", "session") ?? null,
      metadata: { ...(fromData?.metadata ?? {}), ...(fromMeta?.metadata ?? {}) },
    },
    pixelSizeUm,
    lengthFromPixels: length?.unit === "px" ? length.value : null,
  };
}

function show(v: unknown): string {
  if (typeof v === "object" && v !== null && "value" in v) return `${(v as { value: number }).value}`;
  return typeof v === "string" ? `"${v}"` : String(v);
}

function resolvePositionUnit(
  column: ColumnHeader,
  options: ResolvedImportOptions,
  file: string,
  issues: IssueCollector,
  warnings: WarningCollector,
  profiles: RawProfile[],
): { unit: PositionUnit; factor: number } {
  if (options.positionUnit !== "auto") return { unit: options.positionUnit, factor: 1 };
  if (column.unitText !== null) {
    const u = lengthUnit(column.unitText);
    if (u === null) {
      issues.add({ file, column: column.header }, `unknown position unit "${column.unitText}"; positions can be in ${KNOWN_LENGTH_UNITS}`);
      return { unit: "um", factor: 1 };
    }
    return u;
  }
  const allWithinUnit = profiles.every((p) => p.positions.every((x) => x >= 0 && x <= 1));
  warnings.add(
    "assumed-unit",
    null,
    () =>
      `the position column "${column.header}" names no unit; positions were read as µm` +
      (allWithinUnit ? " although all of them lie between 0 and 1, as fractions of length would" : ""),
    `write the unit in the header ("position [µm]", "x (px)", "x/L") or pass --position-unit um|px|fraction`,
  );
  return { unit: "um", factor: 1 };
}

function toRecord(
  raw: RawProfile,
  channel: string,
  unit: { unit: PositionUnit; factor: number },
  pixelSizeUm: number | null,
  lengthUm: number | null,
  flip: boolean,
): ProfileRecord {
  const n = raw.positions.length;
  const scaled = new Float64Array(n);
  for (let i = 0; i < n; i++) scaled[i] = raw.positions[i] * unit.factor;
  const umPerUnit = unit.unit === "um" ? 1 : unit.unit === "px" ? pixelSizeUm! : lengthUm!;
  let positionsRaw = scaled;
  let intensities = new Float64Array(raw.intensities);
  if (flip) {
    // Mirror about the embryo's far end when its length is known, else about the profile's own span.
    const lengthInUnit =
      unit.unit === "fraction" ? 1 : lengthUm === null ? null : unit.unit === "px" ? lengthUm / pixelSizeUm! : lengthUm;
    const anchor = lengthInUnit ?? scaled[0] + scaled[n - 1];
    positionsRaw = Float64Array.from({ length: n }, (_, i) => anchor - scaled[n - 1 - i]);
    intensities = Float64Array.from({ length: n }, (_, i) => raw.intensities[n - 1 - i]);
  }
  return {
    embryo: raw.embryo,
    channel,
    timeS: raw.timeS,
    positionUnit: unit.unit,
    pixelSizeUm: unit.unit === "px" ? pixelSizeUm : null,
    positionsRaw,
    positionsUm: positionsRaw.map((x) => x * umPerUnit),
    intensities,
    droppedPoints: raw.dropped,
    flipped: flip,
  };
}

function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(1)} MB`;
  if (n >= 1024) return `${(n / 1024).toFixed(1)} kB`;
  return `${n} bytes`;
}
