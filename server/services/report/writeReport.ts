import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import type { ChartConfiguration } from "chart.js";
import type { Db } from "../../../db/connection.ts";
import { renderChart } from "../../figures/renderChart.ts";
import type { ProgressCallback } from "../../jobs/jobTypes.ts";
import { csvText } from "../exports/csvText.ts";
import { fitRowsTable } from "../exports/fitTable.ts";
import { storedTable } from "../exports/storedTable.ts";
import type { EmbeddedFigure } from "./embeddedFigure.ts";
import { gatherReport } from "./gatherReport.ts";
import { reportFigures } from "./reportFigures.ts";
import { reportHtml, type ReportMeta } from "./reportHtml.ts";
import type { ReportOptions } from "./reportOptions.ts";

/** Resolution of the figures embedded in the page (the files beside it are at 300 dpi). */
const EMBEDDED_DPI = 150;

/** Every file a report wrote, relative to its folder, and what the report had to run itself. */
export interface ReportManifest {
  out: string;
  index: string;
  figures: { kind: string; png: string; svg: string }[];
  tables: string[];
  /** Profiles fitted, and precision analyses run, by the report because none were stored. */
  ranByReport: { fits: number; precisionAnalyses: number };
}

/**
 * Write a report into `outDir`: index.html (self-contained), figures/*.png at
 * 300 dpi and figures/*.svg, tables/*.csv. Files of the same name are
 * replaced; nothing else in the folder is touched.
 */
export function writeReport(db: Db, outDir: string, options: ReportOptions, meta: ReportMeta, progress: ProgressCallback = () => {}): ReportManifest {
  const data = gatherReport(db, options, (f, stage) => progress(0.6 * f, stage));
  mkdirSync(join(outDir, "figures"), { recursive: true });
  mkdirSync(join(outDir, "tables"), { recursive: true });
  const specs = reportFigures(data);
  const figures: EmbeddedFigure[] = specs.map((spec, i) => {
    progress(0.6 + (0.35 * i) / Math.max(1, specs.length), `figure ${spec.baseName}`);
    const config = spec.config as unknown as ChartConfiguration;
    const pngPath = `figures/${spec.baseName}.png`;
    const svgPath = `figures/${spec.baseName}.svg`;
    writeFileSync(join(outDir, pngPath), renderChart(config, { format: "png", dpi: 300 }));
    writeFileSync(join(outDir, svgPath), renderChart(config, { format: "svg" }));
    const png = renderChart(config, { format: "png", dpi: EMBEDDED_DPI });
    return { section: spec.section, kind: spec.kind, title: spec.baseName, caption: spec.caption, png, pngPath, svgPath };
  });
  progress(0.95, "tables");
  const tables: string[] = [];
  const write = (fileName: string, csv: string) => {
    const path = `tables/${fileName}`;
    writeFileSync(join(outDir, path), csv);
    tables.push(path);
  };
  write("fits.csv", csvText(fitRowsTable(data.groups.flatMap((g) => g.fits))));
  for (const g of data.groups) if (g.precision) {
    const t = storedTable(db, { table: "precision", analysis: g.precision.provenance.analysisId, channel: g.channel });
    write(t.fileName, t.csv);
  }
  for (const [table, items] of [["comparison", data.comparisons], ["tracking", data.trackings], ["plan", data.plans]] as const) {
    for (const item of items) {
      const t = storedTable(db, { table, analysis: item.provenance.analysisId });
      write(t.fileName, t.csv);
    }
  }
  writeFileSync(join(outDir, "index.html"), reportHtml(data, figures, tables, meta));
  progress(1, "done");
  return {
    out: outDir,
    index: "index.html",
    figures: figures.map((f) => ({ kind: f.kind, png: f.pngPath, svg: f.svgPath })),
    tables,
    ranByReport: { fits: data.groups.reduce((n, g) => n + g.fittedByReport, 0), precisionAnalyses: data.groups.filter((g) => g.precision?.provenance.runByReport).length },
  };
}
