import { PrecisionRequest } from "../services/precision/precisionRequest.ts";
import { preparePrecisionInput, storePrecisionOutput } from "../services/precision/precisionService.ts";
import { runPrecisionTask } from "../services/precision/precisionTask.ts";
import { UserError } from "../userError.ts";
import { numberOption, rangeOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { significant } from "./formatEstimate.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { progressReporter } from "./progressReporter.ts";
import { zodToUserError } from "./zodToUserError.ts";
import { leftOutText } from "./inputsText.ts";
import { genotypeSelection } from "./groupOptions.ts";

export const precisionCommand: Command = {
  name: "precision",
  summary: "positional error σ_x, boundary variability and positional information across replicate embryos",
  help: `Usage: morphogauge precision [--genotype G] [--channel C[,C2]] [--coords absolute|relative] [--normalize M] [--threshold V | --at-position X] [--bootstrap N] [options]

Analyses each genotype (or the one chosen) as a group of replicate embryos.
σ_x(x) = σ_c(x) / |dc̄/dx|: the spread of intensity across embryos divided by
the slope of the mean profile, with a bootstrap band over embryos.

  --genotype G[,G2…]    only these groups (default: every genotype, one result each)
  --channel C[,C2]      channel, or several measured in the same embryos for the joint σ_x
  --coords C            absolute (µm, default) | relative (fraction x/L of each embryo's length)
  --normalize M         none (default) | minmax | scale-offset (fits each embryo's scale and
                        offset to the group mean: removes imaging-intensity differences)
  --flip auto|none      auto flips embryos that run against their group (default none: flag only)
  --derivative D        savitzky-golay (default) | model (exponential fitted to the mean)
  --window A:B          fit window of the model derivative (A: or :B leave one end open;
                        grid units); default: the region below
  --threshold V         boundary threshold intensity (after normalisation)
  --at-position X       or: the threshold is the mean's level at X (grid units)
  --positions X,Y       also report σ_x at these positions
  --region A:B          region for positional information and the headline σ_x, the same
                        for every group (µm, or fraction with relative coords); default:
                        the span every profile covers, trimmed by 10% at each end
  --spacing S           grid spacing (µm, or fraction with relative coords)
  --min-slope-snr S     leave out positions whose slope is below S standard errors (default 3)
  --max-sigma-fraction F leave out σ_x above F of the grid span (default 0.25)
  --bootstrap N         resamples of whole embryos (default 1000)
  --seed N              bootstrap seed (default 1)
  --include-excluded    also use excluded embryos (left out and listed by default)
${COMMON_HELP}

The headline σ_x is the geometric mean of σ_x over the region; positional
information is the direct estimate extrapolated to infinitely many embryos
(needs 12 or more) beside the small-noise approximation. Positions in the region
whose slope the data cannot resolve count as carrying no information.

With --json: one object for one group, or {"results": [...]} for several.
Stable fields: information_region {from, to, unit}, sigma_x_summary {value, ci95,
method}, positional_information_bits.small_noise and .direct_extrapolated {value, ci95}.`,
  options: {
    ...COMMON_OPTIONS,
    genotype: { type: "string" },
    channel: { type: "string" },
    coords: { type: "string" },
    normalize: { type: "string" },
    flip: { type: "string" },
    derivative: { type: "string" },
    window: { type: "string" },
    threshold: { type: "string" },
    "at-position": { type: "string" },
    positions: { type: "string" },
    region: { type: "string" },
    spacing: { type: "string" },
    bootstrap: { type: "string" },
    seed: { type: "string" },
    "min-slope-snr": { type: "string" },
    "max-sigma-fraction": { type: "string" },
    "include-excluded": { type: "boolean", default: false },
  },
  async run(values, _positionals, io) {
    if (values.threshold !== undefined && values["at-position"] !== undefined) throw new UserError("bad-option", "give either --threshold or --at-position, not both");
    const region = rangeOption("region", values.region as string | undefined);
    if (region && (region.min === undefined || region.max === undefined)) throw new UserError("bad-option", "--region needs both ends, e.g. 50:300");
    const window = rangeOption("window", values.window as string | undefined);
    if (window && values.derivative !== "model") throw new UserError("bad-option", "--window sets the fit window of the model derivative; add --derivative model");
    const parsed = PrecisionRequest.safeParse({
      selection: genotypeSelection(values.genotype as string | undefined),
      channels: (values.channel as string | undefined)?.split(",").map((c) => c.trim()),
      coords: values.coords,
      normalisation: values.normalize,
      flip: values.flip,
      derivative: values.derivative,
      modelWindow: window ? { from: window.min, to: window.max } : undefined,
      threshold: numberOption("threshold", values.threshold as string | undefined),
      atPosition: numberOption("at-position", values["at-position"] as string | undefined),
      positions: ((values.positions as string | undefined) ?? "").split(",").filter((s) => s.trim()).map((s) => numberOption("positions", s)!),
      region: region ? [region.min, region.max] : undefined,
      spacing: numberOption("spacing", values.spacing as string | undefined),
      bootstrap: numberOption("bootstrap", values.bootstrap as string | undefined),
      includeExcluded: values["include-excluded"],
      seed: numberOption("seed", values.seed as string | undefined),
      mask: {
        minSlopeSnr: numberOption("min-slope-snr", values["min-slope-snr"] as string | undefined),
        maxSigmaFraction: numberOption("max-sigma-fraction", values["max-sigma-fraction"] as string | undefined),
      },
    });
    if (!parsed.success) throw zodToUserError(parsed.error, { normalisation: "normalize", channels: "channel", atPosition: "at-position" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const input = preparePrecisionInput(db, parsed.data);
      const progress = progressReporter(io, "precision");
      const output = runPrecisionTask(input, progress.update);
      progress.done();
      const { results } = storePrecisionOutput(db, input, output);
      if (values.json) {
        io.stdout(JSON.stringify(results.length === 1 ? results[0] : { results }, null, 2) + "\n");
        return 0;
      }
      for (const r of results) {
        const u = r.unit === "um" ? " µm" : " (fraction of length)";
        const b = r.boundary;
        const pi = r.positional_information_bits;
        const ci = (c: [number, number] | null | undefined) => (c ? ` [${significant(c[0])}, ${significant(c[1])}]` : "");
        const bits = (e: { value: number; ci95: [number, number] | null } | null) => (e ? `${significant(e.value)}${ci(e.ci95)} bits` : "—");
        const region = r.information_region;
        const sx = r.sigma_x_summary;
        io.stdout(`\n${r.group} / ${r.channel}: ${r.n_embryos} embryos, ${r.coords} coordinates, normalisation ${r.normalisation}; slope from ${r.derivative}\n`);
        const exact = (v: number) => String(Number(v.toPrecision(6)));
        if (region) io.stdout(`  region ${exact(region.from)}–${exact(region.to)}${u} (${region.description})\n`);
        if (sx) io.stdout(`  σ_x over the region = ${significant(sx.value)}${u}${ci(sx.ci95)}${sx.fraction_of_length ? ` (${(sx.fraction_of_length.value * 100).toFixed(1)}% of length)` : ""}; geometric mean${sx.positions_without_information ? `, ${sx.positions_without_information} of ${sx.region_positions} positions without a resolved slope count as no information` : ""}\n`);
        if (b && b.sd !== null) io.stdout(`  boundary at threshold ${significant(b.threshold)} a.u.: mean position ${significant(b.mean_position ?? NaN)}, SD ${significant(b.sd)}${u}${ci(b.sd_ci95)}; σ_x there ${b.sigma_x_at_threshold ? significant(b.sigma_x_at_threshold.value) : "—"}\n`);
        io.stdout(`  positional information: ${bits(pi.direct_extrapolated)} (direct, extrapolated to infinitely many embryos), ${bits(pi.small_noise)} (small-noise)\n`);
        if (r.slope_model) io.stdout(`  model slope: exponential λ = ${significant(r.slope_model.lambda)}${u}, ${r.slope_model.window ? `fitted over ${significant(r.slope_model.window[0])}–${significant(r.slope_model.window[1])}${u}, ` : ""}refitted in every bootstrap resample\n`);
        if (r.joint?.sigma_x_summary) io.stdout(`  joint σ_x from ${r.joint.channels.join(" + ")} over the region: ${significant(r.joint.sigma_x_summary.value)}${u}${ci(r.joint.sigma_x_summary.ci95)}\n`);
        for (const w of r.warnings) io.stdout(`  ! ${w.message}\n`);
        if (r.left_out.length) io.stdout(`  left out (excluded): ${r.left_out.map(leftOutText).join("; ")}\n`);
      }
      return 0;
    } finally {
      db.close();
    }
  },
};
