import { formatInterval, formatNumber } from "../../../client/figures/figureNumbers.ts";
import { figureHtml, type EmbeddedFigure } from "./embeddedFigure.ts";
import { escapeHtml } from "./escapeHtml.ts";
import type { GroupReport } from "./gatherReport.ts";
import { settingsBlock } from "./settingsBlock.ts";
import { leftOutHtml } from "./analysisInputsHtml.ts";

const bits = (v: number | null, ci: readonly [number, number] | null | undefined) => (v === null ? "—" : `${formatNumber(v)} bits ${formatInterval(ci)}`.trim());

/** The positional-precision section of one group: σ_x, boundary variability and positional information with their settings and figures. */
export function precisionSection(g: GroupReport, bootstrap: number, figures: EmbeddedFigure[]): string {
  const head = `<h3>${escapeHtml(g.genotype)} / ${escapeHtml(g.channel)}</h3>`;
  if (!g.precision) return `<section class="group">${head}<p class="note">No precision analysis: ${escapeHtml(g.precisionNote ?? "not available")}</p></section>`;
  const p = g.precision.response;
  const prov = g.precision.provenance;
  const u = p.unit === "um" ? "µm" : "of length";
  const items: string[] = [`${p.n_embryos} embryos, ${p.coords} coordinates, normalisation ${p.normalisation}; slope from ${p.derivative}.`];
  if (p.min_sigma_x) items.push(`Minimal σ_x = ${formatNumber(p.min_sigma_x.value)} ${u} ${formatInterval(p.min_sigma_x.ci95)} at ${formatNumber(p.min_sigma_x.position)} ${u}${p.min_sigma_x.fraction_of_length ? ` (${formatNumber(p.min_sigma_x.fraction_of_length.value * 100)}% of the length)` : ""}.`);
  if (p.mean_sigma_x) items.push(`Mean σ_x over the information region = ${formatNumber(p.mean_sigma_x.value)} ${u} ${formatInterval(p.mean_sigma_x.ci95)}.`);
  const b = p.boundary;
  if (b && b.sd !== null) items.push(`Boundary at ${formatNumber(b.threshold)} a.u. (${b.threshold_source}): mean position ${formatNumber(b.mean_position ?? NaN)} ${u}, SD ${formatNumber(b.sd)} ${u} ${formatInterval(b.sd_ci95)}; σ_x there ${b.sigma_x_at_threshold ? `${formatNumber(b.sigma_x_at_threshold.value)} ${u}` : "—"}${b.never_cross.length ? `; ${b.never_cross.length} embryo(s) never cross` : ""}.`);
  const pi = p.positional_information_bits;
  items.push(`Positional information: ${bits(pi.small_noise, pi.ci95.small_noise)} (small-noise approximation), ${bits(pi.direct, pi.ci95.direct)} (direct estimate)${pi.direct_extrapolated ? `, ${bits(pi.direct_extrapolated.value, pi.direct_extrapolated.ci95)} extrapolated to infinitely many embryos` : ""}. ${pi.note}`);
  if (p.joint?.min_sigma_x) items.push(`Joint σ_x from ${p.joint.channels.join(" + ")}: minimal ${formatNumber(p.joint.min_sigma_x.value)} ${u} at ${formatNumber(p.joint.min_sigma_x.position)} ${u}.`);
  const warnings = p.warnings.length ? `<ul class="warnings">${p.warnings.map((w) => `<li>${escapeHtml(w.message)}${w.fix ? ` — ${escapeHtml(w.fix)}` : ""}</li>`).join("")}</ul>` : "";
  const ran = prov.runByReport ? `<p class="note">No precision analysis of this group was stored, so this report ran one with the default settings and ${bootstrap} bootstrap resamples (fewer than the default 1000, to keep the report quick); its intervals are correspondingly rougher.</p>` : "";
  const settings = settingsBlock(`Settings of precision analysis #${prov.analysisId}: engine ${prov.engineVersion}, stored ${prov.createdAt}${prov.runByReport ? ", run by this report" : ""}`, { request: prov.settings, resolved: p.settings });
  return `<section class="group">${head}${ran}<ul>${items.map((i) => `<li>${escapeHtml(i)}</li>`).join("")}</ul>${leftOutHtml(p.left_out)}${warnings}${settings}<div class="figures">${figures.map(figureHtml).join("")}</div></section>`;
}
