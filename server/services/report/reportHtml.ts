import { steadyStateCaveat } from "../../analysis/derived.ts";
import { ENGINE_VERSION } from "../../version.ts";
import type { EmbeddedFigure } from "./embeddedFigure.ts";
import { escapeHtml } from "./escapeHtml.ts";
import { fitSection } from "./fitSection.ts";
import type { ReportData } from "./gatherReport.ts";
import { groupAnalysesSection } from "./groupAnalysesSection.ts";
import { precisionSection } from "./precisionSection.ts";
import { provenanceSection } from "./provenanceSection.ts";
import { REPORT_CSS } from "./reportStyles.ts";

export interface ReportMeta {
  /** The database file the report was made from. */
  database: string;
  /** When the report was made (ISO 8601), as stated on the page. */
  generatedAt: string;
  toolVersion: string;
}

export const RESEARCH_USE = "morphogauge is a research tool: its numbers support, and do not replace, the lab's own judgement of the images and the biology. Check fits by eye, read the warnings and decide yourself about outliers; conclusions rest with the lab's judgement.";

/**
 * The report page: self-contained HTML (inline style sheet, figures as
 * data-URI SVG, no scripts and no requests to anything outside the file).
 */
export function reportHtml(data: ReportData, figures: EmbeddedFigure[], tables: string[], meta: ReportMeta): string {
  const figuresOf = (section: string) => figures.filter((f) => f.section === section);
  const groupKey = (g: ReportData["groups"][number]) => `group:${g.genotype}/${g.channel}`;
  const isFitFigure = (f: EmbeddedFigure) => f.kind === "profile-fit" || f.kind === "residuals";
  const fitFigures = (g: ReportData["groups"][number]) => figuresOf(groupKey(g)).filter(isFitFigure);
  const precisionFigures = (g: ReportData["groups"][number]) => figuresOf(groupKey(g)).filter((f) => !isFitFigure(f));
  const contents = [
    ["provenance", "Data provenance"], ["fits", "Decay lengths"], ["precision", "Positional precision"], ["comparisons", "Group comparisons"], ["tracking", "Tracking"], ["plans", "Sample-size plans"], ["files", "Files"],
  ];
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>morphogauge report — ${escapeHtml(data.genotypes.join(", "))}</title>
<style>${REPORT_CSS}</style>
</head>
<body>
<header>
<h1>morphogauge report</h1>
<p>Genotypes ${escapeHtml(data.genotypes.join(", "))}; channels ${escapeHtml(data.channels.join(", "))}. Made ${escapeHtml(meta.generatedAt)} from ${escapeHtml(meta.database)} by morphogauge ${escapeHtml(meta.toolVersion)} (${escapeHtml(ENGINE_VERSION)}). Every number below is shown with the settings that produced it (open “Settings”); lengths in µm, intensities in a.u. unless stated.</p>
<div class="caveat"><p><strong>What a steady-state profile can tell.</strong> ${escapeHtml(steadyStateCaveat)}</p><p><strong>Research use.</strong> ${escapeHtml(RESEARCH_USE)}</p></div>
<nav><ul>${contents.map(([id, t]) => `<li><a href="#${id}">${escapeHtml(t)}</a></li>`).join("")}</ul></nav>
</header>
<main>
${provenanceSection(data.imports)}
<section id="fits"><h2>Decay lengths</h2><p>λ of each embryo's newest fit (each profile fitted alone) with its standard error and 95% CI from the least-squares covariance, and the global fits that share one λ across a group's embryos.</p>${data.groups.map((g) => fitSection(g, fitFigures(g))).join("")}</section>
<section id="precision"><h2>Positional precision</h2><p>Positional error σ_x(x) = σ_c(x)/|dc̄/dx| (Gregor, Tank, Wieschaus, Bialek 2007, Cell), boundary variability and positional information (Dubuis et al. 2013, PNAS; Tkačik, Dubuis, Petkova, Gregor 2015, Genetics), with bootstrap intervals over embryos.</p>${data.groups.map((g) => precisionSection(g, data.bootstrap, precisionFigures(g))).join("")}</section>
${groupAnalysesSection(data, figuresOf)}
<section id="files"><h2>Files</h2><p>Figures (PNG at 300 dpi and SVG) are in figures/, tables (CSV, units in the column names) in tables/:</p><ul>${[...figures.flatMap((f) => [f.pngPath, f.svgPath]), ...tables].map((f) => `<li>${escapeHtml(f)}</li>`).join("")}</ul></section>
</main>
<footer><p class="note">${escapeHtml(RESEARCH_USE)}</p></footer>
</body>
</html>
`;
}
