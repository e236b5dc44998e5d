import { readFile } from "node:fs/promises";
import { basename, resolve } from "node:path";
import { decodeText } from "../import/decodeText.ts";
import { FrapRequest } from "../services/dynamics/dynamicsRequests.ts";
import { prepareFrap, runFrapTask, storeFrap } from "../services/dynamics/frapService.ts";
import { UserError } from "../userError.ts";
import { numberOption, rangeOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { quantityLines } from "./dynamicsOptions.ts";
import { formatEstimate } from "./formatEstimate.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { zodToUserError } from "./zodToUserError.ts";

export const frapCommand: Command = {
  name: "frap",
  summary: "fit FRAP recovery curves: D, mobile fraction and half-time",
  help: `Usage: morphogauge frap FILE… --geometry spot|strip|rod [--radius UM | --width UM] [options]

Each FILE is a table with a time column (s; pre-bleach frames at negative times
or flagged in a "prebleach" column) and the bleached-region intensity
("bleached"), optionally "reference" and "background" columns; or an already
normalised curve ("normalised", pre-bleach = 1). The intensity just after the
bleach is fitted, not taken from the first frame.

  --geometry G          spot (circular, 2D), strip (1D, infinite line) or rod (strip in a closed rod)
  --radius UM           spot radius (µm)
  --width UM            strip width (µm)
  --strip A:B           rod: the bleached strip from A to B µm
  --rod-length UM       rod: its length (µm)
  --fit-turnover        also fit a degradation rate (deficit decays as e^(−kt))
  --turnover K          a known degradation rate K (1/s), e.g. ln2 / half-life
${COMMON_HELP}`,
  allowPositionals: true,
  options: {
    ...COMMON_OPTIONS,
    geometry: { type: "string" },
    radius: { type: "string" },
    width: { type: "string" },
    strip: { type: "string" },
    "rod-length": { type: "string" },
    "fit-turnover": { type: "boolean", default: false },
    turnover: { type: "string" },
  },
  async run(values, positionals, io) {
    if (positionals.length === 0) throw new UserError("bad-option", "give at least one FRAP table: morphogauge frap FILE… --geometry spot --radius 1.5");
    const kind = values.geometry as string | undefined;
    let geometry: unknown;
    if (kind === "spot") {
      const r = numberOption("radius", values.radius as string | undefined);
      if (r === undefined) throw new UserError("bad-option", "--geometry spot needs --radius (µm)");
      geometry = { kind, radiusUm: r };
    } else if (kind === "strip") {
      const w = numberOption("width", values.width as string | undefined);
      if (w === undefined) throw new UserError("bad-option", "--geometry strip needs --width (µm)");
      geometry = { kind, widthUm: w };
    } else if (kind === "rod") {
      const s = rangeOption("strip", values.strip as string | undefined);
      const l = numberOption("rod-length", values["rod-length"] as string | undefined);
      if (!s || s.min === undefined || s.max === undefined || l === undefined) throw new UserError("bad-option", "--geometry rod needs --strip A:B and --rod-length (µm)");
      geometry = { kind, fromUm: s.min, toUm: s.max, lengthUm: l };
    } else throw new UserError("bad-option", `--geometry: "${kind ?? ""}" is not one of spot, strip, rod`);
    const turnover = numberOption("turnover", values.turnover as string | undefined);
    if (turnover !== undefined && values["fit-turnover"]) throw new UserError("bad-option", "--turnover and --fit-turnover exclude each other");
    const degradation = values["fit-turnover"] ? { mode: "fit" } : turnover !== undefined ? { mode: "fixed", perS: turnover } : { mode: "none" };
    const files = await Promise.all(
      positionals.map(async (p) => {
        const path = resolve(io.cwd, p);
        let bytes: Uint8Array;
        try {
          bytes = await readFile(path);
        } catch {
          throw new UserError("file-not-found", `${p}: cannot read this file`);
        }
        return { name: basename(path), text: decodeText(bytes, basename(path)) };
      }),
    );
    const parsed = FrapRequest.safeParse({ files, options: { geometry, degradation } });
    if (!parsed.success) throw zodToUserError(parsed.error);
    const input = prepareFrap(parsed.data);
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const out = storeFrap(db, input, runFrapTask(input));
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      io.stdout(`FRAP analysis ${out.analysis_id}: ${out.n_fitted} of ${out.n_curves} curves fitted (${out.summary_method})\n`);
      for (const line of quantityLines(out as unknown as Record<string, unknown>, formatEstimate)) io.stdout(line + "\n");
      for (const c of out.curves) {
        io.stdout(`\n${c.name}: ${c.status === "ok" ? `D = ${formatEstimate(c.D_um2_per_s, "µm²/s")}, mobile fraction ${formatEstimate(c.mobile_fraction)}, t½ = ${formatEstimate(c.half_time_s, "s")}` : c.message}\n`);
        io.stdout(`  normalisation: ${c.normalisation.join("; ")}\n`);
        for (const w of c.warnings) io.stdout(`  warning: ${w}\n`);
      }
      io.stdout(`\n${out.caveat}\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};
