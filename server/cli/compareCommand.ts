import { CompareRequest } from "../services/groups/compareRequest.ts";
import { prepareComparison, storeComparison } from "../services/groups/compareService.ts";
import { runCompareTask } from "../services/groups/compareTask.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { significant } from "./formatEstimate.ts";
import { formatTable } from "./formatTable.ts";
import { GROUP_HELP, GROUP_OPTIONS, groupRequestFields } from "./groupOptions.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { progressReporter } from "./progressReporter.ts";
import { zodToUserError } from "./zodToUserError.ts";

const pv = (p: number | null) => (p === null ? "—" : p < 0.0001 ? "<0.0001" : p.toFixed(4));
const ci = (c: [number, number] | null | undefined) => (c ? `[${significant(c[0])}, ${significant(c[1])}]` : "");

export const compareCommand: Command = {
  name: "compare",
  summary: "compare groups (genotypes, stages, …): λ, amplitude, boundary or spread, with CIs and tests",
  help: `Usage: morphogauge compare [--by genotype|stage|channel|FIELD] [--reference G] [--metric M] [--permutations N] [options]

Summarises each group (n, mean, SD, SEM, median, 95% t interval of the mean)
and contrasts every pair of groups, or each group against --reference: the
difference with Welch's t interval and the ratio with Fieller's interval (both
agree with Welch's p and hold their level with 6–15 embryos per group),
bootstrap intervals as a second opinion, a permutation test, Hedges' g, and
Holm-adjusted p-values (of Welch's p) across the contrasts.

  --by FIELD            what defines the groups (default genotype; also stage, session,
                        dosage or any metadata column)
  --reference G         compare each group with G instead of every pair
  --metric M            lambda (default) | amplitude | boundary | sigma_x
  --permutations N      relabellings per permutation test (default 10000)
  --bootstrap N         bootstrap resamples per interval (default 2000)
${GROUP_HELP}
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, ...GROUP_OPTIONS, by: { type: "string" }, reference: { type: "string" }, metric: { type: "string" }, permutations: { type: "string" }, bootstrap: { type: "string" } },
  async run(values, _positionals, io) {
    const parsed = CompareRequest.safeParse({
      ...groupRequestFields(values),
      by: values.by,
      reference: values.reference,
      metric: values.metric,
      permutations: numberOption("permutations", values.permutations as string | undefined),
      bootstrap: numberOption("bootstrap", values.bootstrap as string | undefined),
    });
    if (!parsed.success) throw zodToUserError(parsed.error, { fitModel: "fit-model" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const prepared = prepareComparison(db, parsed.data);
      const progress = progressReporter(io, "comparing");
      const result = runCompareTask(prepared.task, progress.update);
      progress.done();
      const out = storeComparison(db, prepared, result);
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      const key = out.metric === "lambda" ? "lambda_um" : out.metric === "amplitude" ? "amplitude_au" : out.metric === "boundary" ? "boundary_um" : "boundary_sd_um";
      io.stdout(`Groups by ${out.by}, channel ${out.channel}, metric ${out.metric}\n`);
      io.stdout(
        formatTable(
          ["group", "n", "mean", "SD", "SEM", "median", "95% CI of mean (t)", "bootstrap 95% CI (2nd opinion)"],
          out.groups.map((g) => {
            const s = (g as unknown as Record<string, { mean: number; sd: number | null; sem: number | null; median: number; ci95: [number, number] | null; bootstrap_ci95?: [number, number] | null } | null>)[key];
            return [g.name, String(g.n), s ? significant(s.mean) : "—", s?.sd != null ? significant(s.sd) : "—", s?.sem != null ? significant(s.sem) : "—", s ? significant(s.median) : "—", ci(s?.ci95), ci(s?.bootstrap_ci95)];
          }),
        ),
      );
      io.stdout("\n");
      const means = out.metric !== "sigma_x";
      io.stdout(
        formatTable(
          ["a − b", means ? "difference [95% CI, Welch t]" : "difference [95% CI]", means ? "ratio [95% CI, Fieller]" : "ratio [95% CI]", "p (Welch)", "p (permutation)", "p (Holm)", "Hedges' g"],
          out.contrasts.map((c) => [
            `${c.a} − ${c.b}`,
            c.difference ? `${significant(c.difference.value)} ${ci(c.difference.ci95)}` : "—",
            c.ratio ? `${significant(c.ratio.value)} ${ci(c.ratio.ci95)}` : "—",
            pv(c.p_welch),
            pv(c.p_permutation),
            pv(c.p_holm),
            c.effect_size ? significant(c.effect_size.value) : "—",
          ]),
        ),
      );
      if (means && out.contrasts.some((c) => c.difference?.bootstrap_ci95 || c.ratio?.bootstrap_ci95)) {
        io.stdout("\nSecond opinion, not the headline: bootstrap intervals (they under-cover with few embryos per group)\n");
        io.stdout(
          formatTable(
            ["a − b", "difference, bootstrap 95% CI", "ratio, bootstrap 95% CI"],
            out.contrasts.map((c) => [`${c.a} − ${c.b}`, ci(c.difference?.bootstrap_ci95) || "—", ci(c.ratio?.bootstrap_ci95) || "—"]),
          ),
        );
        const method = out.contrasts.find((c) => c.difference?.bootstrap_method)?.difference?.bootstrap_method;
        if (method) io.stdout(`(${method})\n`);
      }
      if (means) io.stdout("Intervals: group means — t interval; differences — Welch's t interval; ratios — Fieller's interval with Welch's df. An interval excludes 0 (difference) or 1 (ratio) exactly when p (Welch) < 0.05.\n");
      for (const c of out.contrasts) if (c.note) io.stdout(`note (${c.a} − ${c.b}): ${c.note}\n`);
      for (const w of out.warnings) io.stdout(`! ${w}\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};
