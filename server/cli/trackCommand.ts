import type { DosageResult } from "../analysis/compare/tracking/dosageSeries.ts";
import { TrackRequest } from "../services/groups/trackRequest.ts";
import { prepareTracking, storeTracking } from "../services/groups/trackService.ts";
import { runTrackTask } from "../services/groups/trackTask.ts";
import { UserError } from "../userError.ts";
import type { ScalingResult } from "../analysis/compare/tracking/sizeScaling.ts";
import type { TrackResult } from "../analysis/compare/tracking/trackOverTime.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { significant } from "./formatEstimate.ts";
import { GROUP_HELP, GROUP_OPTIONS, groupRequestFields } from "./groupOptions.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { zodToUserError } from "./zodToUserError.ts";

const ci = (c: [number, number] | null | undefined) => (c ? ` [${significant(c[0])}, ${significant(c[1])}]` : "");

export const trackCommand: Command = {
  name: "track",
  summary: "follow gradients over stage or age, across a dosage series, or with embryo size",
  help: `Usage: morphogauge track --over stage|age|dosage|length [options]

  --over stage|age      λ (or --metric) against developmental stage or age per genotype, binned,
                        with a linear or saturating trend and a steady-state check
  --over dosage         boundary position against ln(dosage): its slope is λ, independent of
                        any profile fit (Δx = λ·ln f); shown beside λ from the fits
  --over length         λ and boundary position against embryo length, log–log slope
                        (slope 1 = perfect scaling)
  --metric M            lambda (default) | amplitude | boundary (stage/age only)
  --trend T             linear (default) | saturating | none
  --bins N              time bins (default 6)
${GROUP_HELP}
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, ...GROUP_OPTIONS, over: { type: "string" }, metric: { type: "string" }, trend: { type: "string" }, bins: { type: "string" } },
  async run(values, _positionals, io) {
    if (values.over === undefined) throw new UserError("bad-option", "--over is required: stage, age, dosage or length");
    const parsed = TrackRequest.safeParse({ ...groupRequestFields(values), over: values.over, metric: values.metric, trend: values.trend, bins: numberOption("bins", values.bins as string | undefined) });
    if (!parsed.success) throw zodToUserError(parsed.error, { fitModel: "fit-model" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const prepared = prepareTracking(db, parsed.data);
      const out = storeTracking(db, prepared, runTrackTask(prepared.task));
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      const r = out.result as unknown as Record<string, unknown>;
      if (out.over === "dosage") {
        const d = r as unknown as DosageResult;
        io.stdout(`Dosage series (${out.channel}), boundary threshold ${significant(out.boundary_threshold.value)} a.u.\n`);
        for (const lv of d.dosages) {
          const missing = lv.no_crossing.before_start + lv.no_crossing.beyond_end;
          io.stdout(`  dosage ${lv.dosage}×: ${lv.n_embryos} embryos, ${missing} never cross the threshold (${lv.no_crossing.before_start} start below it, ${lv.no_crossing.beyond_end} stay above it); mean boundary of the ${lv.n} that cross ${lv.boundary_um ? significant(lv.boundary_um.mean) : "—"} µm\n`);
        }
        io.stdout(`  λ from the boundary shift: ${d.lambda_from_shift_um ? `${significant(d.lambda_from_shift_um.value)} µm${ci(d.lambda_from_shift_um.ci95)}` : "not estimated"}\n`);
        io.stdout(`  ${d.shift_refused ? `refused: ${d.shift_refused}` : `method: ${d.shift_method ?? "—"}`}\n`);
        io.stdout(`  λ from the profile fits:   ${d.lambda_from_fit_um ? significant(d.lambda_from_fit_um.value) : "—"} µm${ci(d.lambda_from_fit_um?.ci95)}\n`);
        io.stdout(`  ${d.agree === null ? "agreement could not be judged" : d.agree ? "the two estimates agree (CI of the difference contains 0)" : "the two estimates DISAGREE"}\n`);
        io.stdout(`  assumes: ${d.assumptions.join("; ")}\n`);
        for (const w of d.warnings) if (w !== d.shift_refused) io.stdout(`! ${w}\n`);
      } else if (out.over === "length") {
        const s = r as unknown as ScalingResult;
        for (const g of s.groups) io.stdout(`${g.group}: n = ${g.n}; log–log slope of λ on length ${g.lambda ? significant(g.lambda.slope.value) + ci(g.lambda.slope.ci95) : "—"}; of boundary ${g.boundary ? significant(g.boundary.slope.value) + ci(g.boundary.slope.ci95) : "—"} (1 = perfect scaling)\n`);
      } else {
        const t = r as unknown as TrackResult;
        for (const s of t.series) {
          const slope = s.trend?.kind === "linear" ? `trend slope ${significant(s.trend.slope.value)}${ci(s.trend.slope.ci95)} per ${out.over === "age" ? "s" : "stage"}` : s.trend?.kind === "saturating" && s.trend.yInf ? `plateau ${significant(s.trend.yInf.value)}${ci(s.trend.yInf.ci95)}` : (s.trendNote ?? "no trend");
          const steady = s.steadyState?.notAtSteadyState === true ? `NOT at steady state (${s.steadyState.reasons.join("; ")})` : s.steadyState?.notAtSteadyState === false ? "no sign of change late in the range (steady state)" : "steady state not assessed";
          io.stdout(`${s.group}: ${s.n} embryos; ${slope}; ${steady}\n`);
        }
      }
      return 0;
    } finally {
      db.close();
    }
  },
};
