import { csvExportUrl } from "../../api/exportUrl.ts";
import type { PrecisionSummary } from "../../api/types/precision.ts";
import { chartPanel } from "../../components/chartPanel.ts";
import { dataTable } from "../../components/dataTable.ts";
import { el } from "../../components/el.ts";
import { keyNumbers } from "../../components/keyNumbers.ts";
import { errorNotice, infoNotice, warningNotice } from "../../components/notice.ts";
import { excludeButton, includeButton, leftOutText } from "../../components/exclusionControls.ts";
import { boundaryFigure, decodingMapFigure, ensembleFigure, sigmaXFigure } from "../../figures/index.ts";
import { formatEstimate, formatInterval } from "../../format/formatEstimate.ts";
import { formatPercent } from "../../format/formatPercent.ts";
import { formatPlain, formatSignificant } from "../../format/significant.ts";
import { uncertaintyDecimals } from "../../format/uncertaintyDecimals.ts";

const NORMALISATION_WORDS: Record<string, string> = {
  none: "none — intensities as measured (a.u.); real amplitude differences between embryos count as noise",
  minmax: "per embryo, minimum 0 and maximum 1 — removes real amplitude variation, so σ_x can come out smaller than without",
  "scale-offset": "per embryo, scale and offset matched to the mean — removes real amplitude variation, so σ_x can come out smaller than without",
};

/** A length in the analysis's coordinates. */
function lengthText(p: PrecisionSummary, x: number | null | undefined, digits = 3): string {
  if (x === null || x === undefined) return "—";
  return p.unit === "um" ? `${formatSignificant(x, digits)} µm` : `${formatSignificant(x, digits)} (x/L)`;
}

function bits(e: { value: number; ci95?: [number, number] | null } | null | undefined): string {
  if (!e) return "—";
  const { value, ci95: ci } = e;
  const place = ci ? uncertaintyDecimals(Math.abs(ci[1] - ci[0]) / 4) : null;
  return `${formatEstimate({ value, ci95: ci ?? null }, "bits")}${ci ? ` ${formatInterval(ci, place)}` : ""}`;
}

/** Each flagged embryo with a button that excludes it (with a reason) from the next runs. */
function flagsPanel(p: PrecisionSummary): HTMLElement | null {
  const flagged = p.outliers?.flagged ?? [];
  if (flagged.length === 0) return null;
  const embryos = [...new Set(flagged.map((f) => f.embryo))];
  return el(
    "div",
    { class: "flags", "data-role": "precision-flags" },
    el("h3", {}, "Flagged embryos"),
    el(
      "ul",
      {},
      ...embryos.map((embryo) => {
        const why = flagged.filter((f) => f.embryo === embryo).map((f) => `${f.metric}, robust z = ${formatSignificant(f.z, 2)}`).join("; ");
        const slot = el("span", {});
        const done = () => slot.replaceChildren(el("span", { class: "hint", "data-role": "excluded-note" }, "excluded — run the analysis again to leave it out"));
        slot.append(excludeButton({ embryo }, done, `flagged in precision (${why})`));
        return el("li", { "data-embryo": embryo }, `${embryo} (${why}) `, slot);
      }),
    ),
    el("p", { class: "hint" }, "Flagged embryos are kept in the analysis. Exclude one only if its images show a failure; the reason is kept and every later analysis lists it."),
  );
}

/** Who this run left out and why, each with a button to include it again. */
function leftOutPanel(p: PrecisionSummary): HTMLElement {
  const left = p.left_out ?? [];
  if (left.length === 0) return el("p", { class: "hint", "data-role": "left-out" }, "No embryo was left out.");
  const problem = el("div");
  return el(
    "div",
    { "data-role": "left-out" },
    infoNotice(
      el("strong", {}, "Left out (excluded). "),
      el(
        "ul",
        {},
        ...left.map((l) => {
          const slot = el("span", {});
          slot.append(includeButton({ embryo: l.embryo, ...(l.scope === "profile" && l.channel ? { channel: l.channel } : {}) }, () => slot.replaceChildren(el("span", { class: "hint" }, "included again — run the analysis again to use it")), (e) => problem.replaceChildren(errorNotice(e))));
          return el("li", { "data-embryo": l.embryo }, `${leftOutText(l)} `, slot);
        }),
      ),
    ),
    problem,
  );
}

/** One group's positional precision: method, headline numbers, the four figures, boundaries per embryo and warnings. */
export function precisionResult(p: PrecisionSummary): HTMLElement {
  const lu = p.unit === "um" ? "µm" : "x/L";
  const b = p.boundary;
  const pi = p.positional_information_bits;
  const source = (kind: string) => ({ kind, query: { analysis: p.analysis_id } });
  const label = `${p.group} · ${p.channel}`;
  const grid = p.settings.grid;

  const boundaryRows = b ? Object.entries(b.positions).map(([embryo, position]) => ({ embryo, position })) : [];
  return el(
    "section",
    { class: "panel precision-result", "data-group": p.group, "data-analysis-id": String(p.analysis_id) },
    el("h2", {}, `${label} — ${p.n_embryos} embryos${p.left_out?.length ? ` (${p.left_out.length} left out)` : ""}`),
    infoNotice(
      el("strong", {}, "Method. "),
      `Positional error σ_x(x) = σ_c(x) / |dc̄/dx| across embryos. Normalisation: ${NORMALISATION_WORDS[p.normalisation] ?? p.normalisation}. `,
      `Slope of the mean: ${p.derivative}. `,
      `Grid: ${lengthText(p, grid.spacing)} spacing over ${lengthText(p, grid.range[0])}–${lengthText(p, grid.range[1])} (${grid.points} points). `,
      `Bands and intervals: ${p.settings.bootstrap.resamples} bootstrap resamples of whole embryos (seed ${p.settings.bootstrap.seed}).`,
    ),
    keyNumbers([
      {
        label: "Region for σ_x and positional information",
        value: p.information_region ? `${lengthText(p, p.information_region.from, 5)}–${lengthText(p, p.information_region.to, 5)}` : "—",
        note: p.information_region?.description,
        key: "information-region",
      },
      {
        label: `σ_x over the region (${lu})`,
        value: p.sigma_x_summary ? formatEstimate(p.sigma_x_summary, lu, { ci: true }) : "—",
        note: p.sigma_x_summary
          ? `geometric mean${p.sigma_x_summary.fraction_of_length ? `; ${formatPercent(p.sigma_x_summary.fraction_of_length.value, 1)} of length` : ""}${p.sigma_x_summary.positions_without_information ? `; ${p.sigma_x_summary.positions_without_information} of ${p.sigma_x_summary.region_positions} positions without a resolved slope count as no information` : ""}`
          : undefined,
        key: "sigma-x-summary",
      },
      {
        label: "Relative error of σ_x from the number of embryos",
        value: p.sigma_x_expected_relative_error === null ? "—" : `about ${formatPercent(p.sigma_x_expected_relative_error)}`,
        note: "≈ 1/√(2(n−1))",
      },
      {
        label: "Positional information, direct (extrapolated to infinitely many embryos)",
        value: bits(pi?.direct_extrapolated),
        note: pi?.direct_raw ? `raw value from all ${p.n_embryos} embryos ${formatSignificant(pi.direct_raw.value, 3)} bits, biased upward` : undefined,
        key: "pi-extrapolated",
      },
      { label: "Positional information, small-noise", value: bits(pi?.small_noise), key: "pi-small-noise" },
      ...(b
        ? [
            { label: `Boundary threshold (${p.normalisation === "none" ? "a.u." : "normalised"})`, value: formatPlain(b.threshold), note: b.threshold_source },
            { label: `Boundary position, mean (${lu})`, value: lengthText(p, b.mean_position, 4) },
            {
              label: `Boundary SD across embryos (${lu})`,
              value: b.sd === null ? "—" : `${formatEstimate({ value: b.sd, ci95: b.sd_ci95 }, lu, { ci: true })}`,
              note: b.sd_bootstrap_ci95 ? `bootstrap ${formatInterval(b.sd_bootstrap_ci95, uncertaintyDecimals(Math.abs(b.sd_bootstrap_ci95[1] - b.sd_bootstrap_ci95[0]) / 4))}` : undefined,
              key: "boundary-sd",
            },
            { label: `σ_x at the threshold (${lu})`, value: b.sigma_x_at_threshold ? formatEstimate(b.sigma_x_at_threshold, lu, { ci: true }) : "—", note: b.sd_over_sigma_x === null ? undefined : `boundary SD / σ_x = ${formatSignificant(b.sd_over_sigma_x, 2)}` },
          ]
        : []),
      ...p.sigma_x_at.map((s) => ({ label: `σ_x at ${lengthText(p, s.position)}`, value: s.value === null ? "— (masked)" : formatEstimate({ value: s.value, ci95: s.ci95 }, lu, { ci: true }) })),
    ]),
    ...(p.per_channel ?? []).map((c) =>
      el(
        "div",
        { class: "other-channel" },
        el("h3", {}, `Channel ${c.channel}, same embryos`),
        keyNumbers([
          { label: `σ_x over the region (${lu})`, value: c.sigma_x_summary ? formatEstimate(c.sigma_x_summary, lu, { ci: true }) : "—" },
          { label: "Positional information, direct (extrapolated)", value: bits(c.positional_information_bits?.direct_extrapolated) },
          { label: "Positional information, small-noise", value: bits(c.positional_information_bits?.small_noise) },
        ]),
      ),
    ),
    p.joint
      ? el(
          "div",
          { class: "joint" },
          el("h3", {}, `Joint readout of ${p.joint.channels.join(" + ")} (${p.joint.n_embryos} embryos, correlations between channels included)`),
          keyNumbers([
            { label: `Joint σ_x over the region (${lu})`, value: p.joint.sigma_x_summary ? formatEstimate(p.joint.sigma_x_summary, lu, { ci: true }) : "—", key: "joint-sigma-x-summary" },
            { label: "Joint positional information, small-noise", value: bits(p.joint.positional_information_bits.small_noise) },
            { label: "Joint positional information, direct (raw, biased upward)", value: bits(p.joint.positional_information_bits.direct_raw) },
          ]),
          el("p", { class: "hint" }, p.joint.note),
        )
      : null,
    pi ? el("p", { class: "hint" }, pi.note) : null,
    ...p.warnings.map((w) => warningNotice(w.message, w.fix)),
    flagsPanel(p),
    leftOutPanel(p),
    el(
      "div",
      { class: "columns" },
      chartPanel(`${label}: mean profile ± SD`, ensembleFigure(p), source("ensemble")),
      chartPanel(`${label}: positional error σ_x with its bootstrap band`, sigmaXFigure(p), source("sigma-x")),
    ),
    el(
      "div",
      { class: "columns" },
      chartPanel(`${label}: boundary positions`, boundaryFigure(p), source("boundary")),
      chartPanel(`${label}: decoding map`, decodingMapFigure(p), source("decoding-map")),
    ),
    el("p", {}, el("a", { class: "btn btn-secondary", href: csvExportUrl("precision", { analysis: p.analysis_id, channel: p.channel }), download: "", "data-role": "csv-precision" }, "Download σ_x(x) and the mean ± SD profile (CSV)")),
    b
      ? dataTable({
          caption: `Boundary position per embryo (${lu}) at threshold ${formatPlain(b.threshold)}${b.never_cross.length ? `; never crossing: ${b.never_cross.join(", ")}` : ""}`,
          rows: boundaryRows,
          csv: { fileName: `boundaries-${p.group}-${p.channel}.csv` },
          columns: [
            { header: "Embryo", cell: (r) => r.embryo },
            { header: `Boundary position (${lu})`, cell: (r) => formatSignificant(r.position, 4), numeric: true },
          ],
        })
      : null,
  );
}
