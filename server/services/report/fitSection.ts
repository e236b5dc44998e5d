import { formatInterval, formatNumber, formatWithError } from "../../../client/figures/figureNumbers.ts";
import { mean, median, standardDeviation } from "../../analysis/stats/descriptive.ts";
import { figureHtml, type EmbeddedFigure } from "./embeddedFigure.ts";
import { escapeHtml } from "./escapeHtml.ts";
import type { GroupReport } from "./gatherReport.ts";
import { htmlTable } from "./htmlTable.ts";
import { settingsBlock } from "./settingsBlock.ts";

function perEmbryoLine(g: GroupReport): string {
  const lambdas = g.fits.filter((f) => f.model === "exponential" && f.status === "converged" && f.lambdaUm).map((f) => f.lambdaUm!.value);
  if (lambdas.length === 0) return "<p>No converged exponential fit.</p>";
  const sd = lambdas.length > 1 ? ` ± ${formatNumber(standardDeviation(lambdas))}` : "";
  return `<p>Per-embryo λ (exponential fits, ${lambdas.length} converged): mean${sd ? " ± SD" : ""} ${formatNumber(mean(lambdas))}${sd} µm, median ${formatNumber(median(lambdas))} µm.</p>`;
}

function globalTable(g: GroupReport): string {
  if (g.globals.length === 0) return "<p>No global fit is stored for this group.</p>";
  const rows = g.globals.map((e) => {
    const lambda = e.fit.ok ? (e.fit.shared.lambdaUm ?? e.fit.shared.x0Um) : undefined;
    return [e.model, lambda ? formatWithError(lambda.value, lambda.se) : null, lambda ? formatInterval(lambda.ci95) : null, e.fit.ok ? e.fit.aicc?.toFixed(1) : null, e.fit.status, e.summary.fitted, e.summary.meanUm !== null ? `${formatNumber(e.summary.meanUm)}${e.summary.sdUm !== null ? ` ± ${formatNumber(e.summary.sdUm)}` : ""}` : null, `#${e.analysisId}`];
  });
  const table = htmlTable(["model", "shared λ (µm) ± SE", "95% CI (µm)", "AICc", "status", "embryos fitted alone", "their λ mean ± SD (µm)", "analysis"], rows, [false, true, true, true, false, true, true, false]);
  const notes = g.globals.map((e) => `<p class="note">${escapeHtml(e.summary.note)}</p>${settingsBlock(`Settings of global fit #${e.analysisId} (${e.model}): engine ${e.engineVersion}, stored ${e.createdAt}`, e.settings)}`);
  return table + notes.join("");
}

/** The decay-length section of one genotype × channel group: per-embryo fits with their settings, global fits, example figures. */
export function fitSection(g: GroupReport, figures: EmbeddedFigure[]): string {
  const optionKeys = new Map<string, { label: string; options: unknown; engines: Set<string> }>();
  const rows = g.fits.map((f) => {
    const key = JSON.stringify(f.options);
    let entry = optionKeys.get(key);
    if (!entry) optionKeys.set(key, (entry = { label: `S${optionKeys.size + 1}`, options: f.options, engines: new Set() }));
    entry.engines.add(f.engineVersion);
    const l = f.lambdaUm;
    return [f.embryo, f.timeS, f.model, l ? formatWithError(l.value, l.se) : null, l ? formatInterval(l.ci95) : null, f.aicc?.toFixed(1), f.r2?.toFixed(4), f.nPoints, f.status === "converged" ? "converged" : `${f.status}: ${f.message}`, entry.label, f.fitId];
  });
  const table = htmlTable(["embryo", "time (s)", "model", "λ (µm) ± SE", "95% CI (µm)", "AICc", "R²", "points", "status", "settings", "fit id"], rows, [false, true, false, true, true, true, true, true, false, false, true]);
  const settings = [...optionKeys.values()].map((e) => settingsBlock(`${e.label}: fit options (engine ${[...e.engines].join(", ")})`, e.options)).join("");
  const fitted = g.fittedByReport > 0 ? `<p class="note">${g.fittedByReport} profile(s) had no stored fit and were fitted by this report with the default options (exponential model over the whole profile, with an additive background)${g.fittedByReport === g.profiles ? ", and the group was also fitted globally" : ""}.</p>` : "";
  return `<section class="group" id="fits-${escapeHtml(g.genotype)}-${escapeHtml(g.channel)}"><h3>${escapeHtml(g.genotype)} / ${escapeHtml(g.channel)} — ${g.profiles} profiles</h3>${fitted}${perEmbryoLine(g)}<h4>Global fits (one λ shared by all embryos)</h4>${globalTable(g)}<h4>Per-embryo fits (newest of each profile and model)</h4>${table}${settings}<div class="figures">${figures.map(figureHtml).join("")}</div></section>`;
}
