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
  --threshold V         boundary threshold intensity (after normalisation)
  --at-position X       or: the threshold is the mean's level at X (grid units)
  --positions X,Y       also report σ_x at these positions
  --region A:B          region for positional information and mean σ_x
  --spacing S           grid spacing (µm, or fraction with relative coords)
  --min-slope-snr S     leave out positions whose slope is below S standard errors (default 3)
  --max-sigma-fraction F leave out σ_x above F of the grid span (default 0.25)
  --bootstrap N         resamples of whole embryos (default 1000)
  --seed N              bootstrap seed (default 1)
  --include-excluded    also use excluded embryos (left out and listed by default)
${COMMON_HELP}

With --json: one object for one group, or {"results": [...]} for several.`,
  options: {
    ...COMMON_OPTIONS,
    genotype: { type: "string" },
    channel: { type: "string" },
    coords: { type: "string" },
    normalize: { type: "string" },
    flip: { type: "string" },
    derivative: { type: "string" },
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
    const parsed = PrecisionRequest.safeParse({
      selection: genotypeSelection(values.genotype as string | undefined),
      channels: (values.channel as string | undefined)?.split(",").map((c) => c.trim()),
      coords: values.coords,
      normalisation: values.normalize,
      flip: values.flip,
      derivative: values.derivative,
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
        const m = r.min_sigma_x;
        const b = r.boundary;
        const pi = r.positional_information_bits;
        const ci = (c: [number, number] | null | undefined) => (c ? ` [${significant(c[0])}, ${significant(c[1])}]` : "");
        io.stdout(`\n${r.group} / ${r.channel}: ${r.n_embryos} embryos, ${r.coords} coordinates, normalisation ${r.normalisation}\n`);
        if (m) io.stdout(`  minimal σ_x = ${significant(m.value)}${u}${ci(m.ci95)} at ${significant(m.position)}${m.fraction_of_length ? ` (${(m.fraction_of_length.value * 100).toFixed(1)}% of length)` : ""}\n`);
        if (b && b.sd !== null) io.stdout(`  boundary at threshold ${significant(b.threshold)} a.u.: mean position ${significant(b.mean_position ?? NaN)}, SD ${significant(b.sd)}${u}${ci(b.sd_ci95)}; σ_x there ${b.sigma_x_at_threshold ? significant(b.sigma_x_at_threshold.value) : "—"}\n`);
        io.stdout(`  positional information: ${pi.small_noise !== null ? significant(pi.small_noise) : "—"} bits (small-noise)${ci(pi.ci95.small_noise)}, ${pi.direct !== null ? significant(pi.direct) : "—"} bits (direct)${ci(pi.ci95.direct)}\n`);
        if (r.joint?.min_sigma_x) io.stdout(`  joint σ_x from ${r.joint.channels.join(" + ")}: minimal ${significant(r.joint.min_sigma_x.value)}${u} at ${significant(r.joint.min_sigma_x.position)}\n`);
        for (const w of r.warnings) io.stdout(`  ! ${w.message}\n`);
        if (r.left_out.length) io.stdout(`  left out (excluded): ${r.left_out.map(leftOutText).join("; ")}\n`);
      }
      return 0;
    } finally {
      db.close();
    }
  },
};
