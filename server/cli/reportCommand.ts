import { resolve } from "node:path";
import { ReportOptions } from "../services/report/reportOptions.ts";
import { writeReport } from "../services/report/writeReport.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { progressReporter } from "./progressReporter.ts";
import { zodToUserError } from "./zodToUserError.ts";
import { TOOL_VERSION } from "../version.ts";

const list = (v: string | undefined) => (v === undefined ? undefined : v.split(",").map((s) => s.trim()).filter(Boolean));

export const reportCommand: Command = {
  name: "report",
  summary: "write a self-contained HTML report with figures (PNG 300 dpi, SVG) and CSV tables",
  help: `Usage: morphogauge report [--out DIR] [--genotype G[,G2…]] [--channel C[,C2…]] [--bootstrap N] [options]

Writes DIR (default ./report): index.html — one file, figures embedded, no
requests outside it — with the data provenance (imported files and their
SHA-256), λ of every fit and the global fits, positional error and positional
information per genotype, and the stored comparisons, tracking analyses and
plans, each with the settings and engine version that produced it; plus
figures/*.png (300 dpi), figures/*.svg and tables/*.csv.

The newest stored fits and analyses are used. Profiles without a fit are
fitted with the default options (exponential); a genotype without a precision
analysis gets one with the default settings and --bootstrap resamples. Both
are stored in the database like any other run.

  --out DIR             output folder (default ./report); files of the same name are replaced
  --genotype G[,G2…]    only these genotypes (default: all)
  --channel C[,C2…]     only these channels (default: all)
  --bootstrap N         resamples of a precision analysis the report runs itself (default 200)
${COMMON_HELP}

With --json: the list of files written.`,
  options: { ...COMMON_OPTIONS, out: { type: "string" }, genotype: { type: "string" }, channel: { type: "string" }, bootstrap: { type: "string" } },
  async run(values, _positionals, io) {
    const parsed = ReportOptions.safeParse({
      genotypes: list(values.genotype as string | undefined),
      channels: list(values.channel as string | undefined),
      bootstrap: numberOption("bootstrap", values.bootstrap as string | undefined),
    });
    if (!parsed.success) throw zodToUserError(parsed.error, { genotypes: "genotype", channels: "channel" });
    const out = resolve(io.cwd, (values.out as string | undefined) ?? "report");
    const { db, path } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const progress = progressReporter(io, "report");
      const manifest = writeReport(db, out, parsed.data, { database: path, generatedAt: new Date().toISOString(), toolVersion: TOOL_VERSION }, progress.update);
      progress.done();
      if (values.json) {
        io.stdout(JSON.stringify(manifest, null, 2) + "\n");
        return 0;
      }
      const ran = manifest.ranByReport;
      io.stdout(
        `Report written to ${resolve(out, manifest.index)}\n` +
          `  ${manifest.figures.length} figures (PNG at 300 dpi and SVG) in ${resolve(out, "figures")}\n` +
          `  ${manifest.tables.length} tables (CSV) in ${resolve(out, "tables")}\n` +
          (ran.fits ? `  ${ran.fits} profile(s) had no fit and were fitted now with default options\n` : "") +
          (ran.precisionAnalyses ? `  ${ran.precisionAnalyses} precision analysis(es) run now with ${parsed.data.bootstrap} bootstrap resamples\n` : ""),
      );
      return 0;
    } finally {
      db.close();
    }
  },
};
