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
  const region = p.information_region;
  if (region) items.push(`Region for positional information and the headline σ_x: ${formatNumber(region.from)}–${formatNumber(region.to)} ${u} (${region.description}).`);
  const sx = p.sigma_x_summary;
  if (sx) items.push(`Headline σ_x = ${formatNumber(sx.value)} ${u} ${formatInterval(sx.ci95)}${sx.fraction_of_length ? ` (${formatNumber(sx.fraction_of_length.value * 100)}% of the length)` : ""}: ${sx.description}${sx.positions_without_information ? ` ${sx.positions_without_information} of ${sx.region_positions} positions in the region had an unresolved slope and count as carrying no information.` : ""}`);
  const b = p.boundary;
  if (b && b.sd !== null) items.push(`Boundary at ${formatNumber(b.threshold)} a.u. (${b.threshold_source}): mean position ${formatNumber(b.mean_position ?? NaN)} ${u}, SD ${formatNumber(b.sd)} ${u} ${formatInterval(b.sd_ci95)}; σ_x there ${b.sigma_x_at_threshold ? `${formatNumber(b.sigma_x_at_threshold.value)} ${u}` : "—"}${b.never_cross.length ? `; ${b.never_cross.length} embryo(s) never cross` : ""}.`);
  const pi = p.positional_information_bits;
  const est = (e: { value: number; ci95: readonly [number, number] | null } | null) => (e ? bits(e.value, e.ci95) : "—");
  items.push(
    `Positional information: ${est(pi.direct_extrapolated)} (direct estimate extrapolated to infinitely many embryos), ${est(pi.small_noise)} (small-noise approximation); ` +
      `raw direct estimate from all embryos ${pi.direct_raw ? `${formatNumber(pi.direct_raw.value)} bits` : "—"} (biased upward, not a headline). ${pi.note}`,
  );
  if (p.joint?.sigma_x_summary) items.push(`Joint σ_x from ${p.joint.channels.join(" + ")} over the same region: ${formatNumber(p.joint.sigma_x_summary.value)} ${u} ${formatInterval(p.joint.sigma_x_summary.ci95)}.`);
  const warnings = p.warnings.length ? `<ul class="warnings">${p.warnings.map((w) => `<li>${escapeHtml(w.message)}${w.fix ? ` — ${escapeHtml(w.fix)}` : ""}</li>`).join("")}</ul>` : "";
  const ran = prov.runByReport ? `<p class="note">No precision analysis of this group was stored, so this report ran one with the default settings and ${bootstrap} bootstrap resamples (fewer than the default 1000, to keep the report quick); its intervals are correspondingly rougher.</p>` : "";
  const settings = settingsBlock(`Settings of precision analysis #${prov.analysisId}: engine ${prov.engineVersion}, stored ${prov.createdAt}${prov.runByReport ? ", run by this report" : ""}`, { request: prov.settings, resolved: p.settings });
  return `<section class="group">${head}${ran}<ul>${items.map((i) => `<li>${escapeHtml(i)}</li>`).join("")}</ul>${leftOutHtml(p.left_out)}${warnings}${settings}<div class="figures">${figures.map(figureHtml).join("")}</div></section>`;
}
