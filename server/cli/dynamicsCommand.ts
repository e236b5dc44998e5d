import { TimeCourseRequest } from "../services/dynamics/dynamicsRequests.ts";
import { prepareTimeCourse, runTimeCourseTask, storeTimeCourse } from "../services/dynamics/timeCourseService.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { numberListOption, quantityLines } from "./dynamicsOptions.ts";
import { formatEstimate } from "./formatEstimate.ts";
import { genotypeSelection } from "./groupOptions.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { zodToUserError } from "./zodToUserError.ts";

export const dynamicsCommand: Command = {
  name: "dynamics",
  summary: "fit D, k and the source strength to a gradient's build-up over time",
  help: `Usage: morphogauge dynamics [--genotype G] [--channel C] [options]

Fits all stored profiles that carry a time (seconds since production started),
one fit per genotype × channel: D, k and the source strength jointly, with
λ, half-life, the local accumulation time τ(x) and the profile likelihood of k.

  --genotype G[,G2…]    only these genotypes
  --channel C           only this channel
  --embryo E            only this embryo (e.g. frames of one embryo)
  --length UM           finite domain with a closed far end at UM µm (solver);
                        semi-infinite (closed form) when absent
  --source-width UM     production in 0 < x < UM µm instead of an influx at x = 0 (solver)
  --no-background       fit without an additive background
  --calibrated          intensities are concentrations: the amplitude is the flux j0
  --tau-at X,Y          positions (µm) for τ(x) (default: 5 across the data)
${COMMON_HELP}`,
  options: {
    ...COMMON_OPTIONS,
    genotype: { type: "string" },
    channel: { type: "string" },
    embryo: { type: "string" },
    length: { type: "string" },
    "source-width": { type: "string" },
    "no-background": { type: "boolean", default: false },
    calibrated: { type: "boolean", default: false },
    "tau-at": { type: "string" },
  },
  async run(values, _positionals, io) {
    const length = numberOption("length", values.length as string | undefined);
    const width = numberOption("source-width", values["source-width"] as string | undefined);
    const parsed = TimeCourseRequest.safeParse({
      selection: { ...genotypeSelection(values.genotype as string | undefined), channel: values.channel, embryo: values.embryo },
      options: {
        ...(length !== undefined ? { domain: { kind: "finite", lengthUm: length } } : {}),
        ...(width !== undefined ? { source: { kind: "region", widthUm: width } } : {}),
        background: !values["no-background"],
        calibrated: values.calibrated === true,
        accumulationPositionsUm: numberListOption("tau-at", values["tau-at"] as string | undefined),
      },
    });
    if (!parsed.success) throw zodToUserError(parsed.error);
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const input = prepareTimeCourse(db, parsed.data);
      const out = storeTimeCourse(db, input, runTimeCourseTask(input));
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      for (const g of out.groups) {
        io.stdout(`${g.genotype} / ${g.channel}: ${g.n_profiles} profiles at ${g.times_s.length} times, ${g.n_embryos} embryos (analysis ${g.analysis_id})\n`);
        if (g.status !== "ok") {
          io.stdout(`  not fitted: ${g.message}\n`);
          continue;
        }
        for (const line of quantityLines(g as unknown as Record<string, unknown>, formatEstimate)) io.stdout(line + "\n");
        if (g.source_strength) io.stdout(`  ${"source strength".padEnd(16)} ${formatEstimate(g.source_strength, g.source_strength.unit)}\n`);
        if (g.correlation_D_k !== null) io.stdout(`  correlation of D and k: ${g.correlation_D_k.toFixed(2)}\n`);
        const [lo, hi] = g.profile_interval_k ?? [null, null];
        io.stdout(`  k, 95% profile-likelihood interval: [${lo === null ? "not bounded" : lo.toPrecision(3)}, ${hi === null ? "not bounded" : hi.toPrecision(3)}] 1/s\n`);
        for (const w of g.warnings) io.stdout(`  warning: ${w}\n`);
      }
      io.stdout(`\n${out.groups[0]?.caveat ?? ""}\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};
