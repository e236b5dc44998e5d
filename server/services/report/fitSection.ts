import { formatInterval, formatNumber, formatWithError } from "../../../client/figures/figureNumbers.ts";
import { mean, median, standardDeviation } from "../../analysis/stats/descriptive.ts";
import { figureHtml, type EmbeddedFigure } from "./embeddedFigure.ts";
import { escapeHtml } from "./escapeHtml.ts";
import type { GroupReport } from "./gatherReport.ts";
import { htmlTable } from "./htmlTable.ts";
import { settingsBlock } from "./settingsBlock.ts";
import { describeErrorModel } from "../../analysis/fit/describeErrorModel.ts";
import { FitOptions, type ResolvedFitOptions } from "../../analysis/fit/fitOptions.ts";

/** The error model of stored fit options in words; options stored before error models were chosen used the classic covariance. */
function errorModelText(options: unknown): string {
  const o = options as Partial<ResolvedFitOptions>;
  if (o.errorModel !== undefined && o.weights !== undefined) return describeErrorModel({ ...FitOptions.parse({}), errorModel: o.errorModel, weights: o.weights }).description;
  return `classic s²(JᵀJ)⁻¹ covariance, ${o.weights ?? "none"} weights (stored before the error model was reported)`;
}

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
  const notes = g.globals.map((e) => `<p class="note">${escapeHtml(e.summary.note)}</p>${e.modelPreference ? `<p class="note${e.modelPreference.agrees ? "" : " warning"}">${e.modelPreference.agrees ? "" : "Warning: "}${escapeHtml(e.modelPreference.message)}.</p>` : ""}${e.fit.window ? `<p class="note">Window: ${escapeHtml(e.fit.window.description)}.</p>` : ""}${settingsBlock(`Settings of global fit #${e.analysisId} (${e.model}): engine ${e.engineVersion}, stored ${e.createdAt}`, e.settings)}`);
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
    const w = f.fittedWindow;
    const window = w ? `${formatNumber(w.fromUm)}–${formatNumber(w.toUm)}${w.startRule.startsWith("past-source") ? " *" : ""}` : null;
    return [f.embryo, f.timeS, f.model, l ? formatWithError(l.value, l.se) : null, l ? formatInterval(l.ci95) : null, window, f.aicc?.toFixed(1), f.r2?.toFixed(4), f.nPoints, f.status === "converged" ? "converged" : `${f.status}: ${f.message}`, entry.label, f.fitId];
  });
  const table = htmlTable(["embryo", "time (s)", "model", "λ (µm) ± SE", "95% CI (µm)", "window (µm)", "AICc", "R²", "points", "status", "settings", "fit id"], rows, [false, true, false, true, true, false, true, true, true, false, false, true]);
  const trimmed = g.fits.some((f) => f.fittedWindow?.startRule.startsWith("past-source"))
    ? `<p class="note">* The fit starts past a source plateau or dip detected in the profile (the window's start was not given); the settings' window and autoWindow say how to change this.</p>`
    : "";
  const errorModels = [...new Set(g.fits.map((f) => errorModelText(f.options)))];
  const errorNote = `<p class="note">Error model: ${errorModels.map(escapeHtml).join("; ")}.</p>`;
  const settings = [...optionKeys.values()].map((e) => settingsBlock(`${e.label}: fit options (engine ${[...e.engines].join(", ")})`, e.options)).join("");
  const fitted = g.fittedByReport > 0 ? `<p class="note">${g.fittedByReport} profile(s) had no stored fit and were fitted by this report with the default options (exponential model with an additive background, starting past a detected source plateau or dip, intensity weights and HC3 error bars)${g.fittedByReport === g.profiles ? ", and the group was also fitted globally" : ""}.</p>` : "";
  return `<section class="group" id="fits-${escapeHtml(g.genotype)}-${escapeHtml(g.channel)}"><h3>${escapeHtml(g.genotype)} / ${escapeHtml(g.channel)} — ${g.profiles} profiles</h3>${fitted}${perEmbryoLine(g)}<h4>Global fits (one λ shared by all embryos)</h4>${globalTable(g)}<h4>Per-embryo fits (newest of each profile and model)</h4>${table}${trimmed}${errorNote}${settings}<div class="figures">${figures.map(figureHtml).join("")}</div></section>`;
}
