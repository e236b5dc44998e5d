import { PlanRequest } from "../services/groups/trackRequest.ts";
import { preparePlan, storePlan } from "../services/groups/trackService.ts";
import { runPlanTask } from "../services/groups/trackTask.ts";
import { UserError } from "../userError.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { formatTable } from "./formatTable.ts";
import { GROUP_HELP, GROUP_OPTIONS, groupRequestFields } from "./groupOptions.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { progressReporter } from "./progressReporter.ts";
import { zodToUserError } from "./zodToUserError.ts";

export const planCommand: Command = {
  name: "plan",
  summary: "embryos per group needed to detect a given change in λ (or in σ_x)",
  help: `Usage: morphogauge plan --effect 0.15 [--power 0.8] [--alpha 0.05] [--metric lambda|sigma_x] [--group G] [options]

From the observed embryo-to-embryo variability of λ (in --group, or by
default the most variable selected group, which is conservative), the number
of embryos per group needed to detect a relative change --effect with the given power at two-sided level alpha: the normal-approximation
formula, the exact t-test size, and the power of Welch's t-test and of the
permutation test simulated at each n.

  --effect E            relative change to detect, e.g. 0.15 for 15% (required)
  --power P             target power (default 0.8)
  --alpha A             significance level (default 0.05)
  --metric M            lambda (default) | sigma_x (a change in a spread)
  --group G             group whose variability is used (default: the most variable)
${GROUP_HELP}
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, ...GROUP_OPTIONS, effect: { type: "string" }, power: { type: "string" }, alpha: { type: "string" }, metric: { type: "string" }, group: { type: "string" } },
  async run(values, _positionals, io) {
    if (values.effect === undefined) throw new UserError("bad-option", "--effect is required, e.g. --effect 0.15 for a 15% change");
    const parsed = PlanRequest.safeParse({
      ...groupRequestFields(values),
      effect: numberOption("effect", values.effect as string),
      power: numberOption("power", values.power as string | undefined),
      alpha: numberOption("alpha", values.alpha as string | undefined),
      metric: values.metric,
      group: values.group,
    });
    if (!parsed.success) throw zodToUserError(parsed.error, { fitModel: "fit-model" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const prepared = preparePlan(db, parsed.data);
      const progress = progressReporter(io, "planning");
      const out = storePlan(db, prepared, runPlanTask(prepared.options, progress.update));
      progress.done();
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      io.stdout(
        `To detect a ${(out.settings.effect * 100).toFixed(0)}% change in ${out.metric === "lambda" ? "λ" : "spread"} with power ${out.settings.power} at α = ${out.settings.alpha}` +
          (out.cv !== null ? ` (embryo-to-embryo CV ${(out.cv * 100).toFixed(1)}%${out.group ? ` in ${out.group}` : ""})` : "") +
          `: ${out.n_required} embryos per group (normal approximation ${out.n_normal}).\n` +
          (out.variability_group ? `Used the ${out.variability_group.sentence}.\n` : "") +
          "\n",
      );
      io.stdout(
        formatTable(
          ["n per group", "power (exact)", "power (Welch, simulated)", "power (permutation, simulated)"],
          out.table.map((r) => [String(r.n), r.power_analytic.toFixed(3), r.power_simulated?.toFixed(3) ?? "—", r.power_permutation_simulated?.toFixed(3) ?? "—"]),
        ),
      );
      for (const n of out.notes) io.stdout(`note: ${n}\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};
