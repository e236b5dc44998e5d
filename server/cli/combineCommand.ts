import { CombineRequest } from "../services/dynamics/dynamicsRequests.ts";
import { combineFrapWithFit } from "../services/dynamics/combineService.ts";
import { UserError } from "../userError.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { numberListOption, quantityLines } from "./dynamicsOptions.ts";
import { formatEstimate } from "./formatEstimate.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { zodToUserError } from "./zodToUserError.ts";

export const combineCommand: Command = {
  name: "combine",
  summary: "k, half-life, source flux and τ(x) from a FRAP D and a group's steady-state λ",
  help: `Usage: morphogauge combine --frap ANALYSIS_ID --fit GENOTYPE [--channel C] [--model M] [--tau-at X,Y]

Takes D (with its SE) from a stored FRAP analysis and λ from the stored global
fit of a genotype group (morphogauge fit --global), and reports k = D/λ²,
the half-life, the source flux j0 and τ(x), with propagated uncertainty.

  --frap ID             FRAP analysis id (printed by morphogauge frap)
  --fit GENOTYPE        the group whose global fit gives λ
  --channel C           which channel's fit (when there are several)
  --model M             exponential | finite | source (default: exponential if stored)
  --tau-at X,Y          positions (µm) for τ(x) (default 0, λ, 2λ, 3λ)
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, frap: { type: "string" }, fit: { type: "string" }, channel: { type: "string" }, model: { type: "string" }, "tau-at": { type: "string" } },
  async run(values, _positionals, io) {
    const frapId = numberOption("frap", values.frap as string | undefined);
    if (frapId === undefined) throw new UserError("bad-option", "--frap ANALYSIS_ID is required (the id printed by morphogauge frap)");
    if (values.fit === undefined) throw new UserError("bad-option", "--fit GENOTYPE is required (the group whose global fit gives λ)");
    const parsed = CombineRequest.safeParse({ frapAnalysisId: frapId, genotype: values.fit, channel: values.channel, model: values.model, accumulationPositionsUm: numberListOption("tau-at", values["tau-at"] as string | undefined) });
    if (!parsed.success) throw zodToUserError(parsed.error, { frapAnalysisId: "frap", genotype: "fit", accumulationPositionsUm: "tau-at" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const out = combineFrapWithFit(db, parsed.data);
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      io.stdout(`FRAP analysis ${out.frap_analysis_id} + global ${out.model} fit ${out.global_fit_analysis_id} (${out.genotype} / ${out.channel}, ${out.n_embryos} embryos) → analysis ${out.analysis_id}\n`);
      for (const line of quantityLines(out as unknown as Record<string, unknown>, formatEstimate)) io.stdout(line + "\n");
      if (out.source_flux) io.stdout(`  ${"source flux j0".padEnd(16)} ${formatEstimate(out.source_flux, out.source_flux.unit)}\n`);
      for (const m of out.method) io.stdout(`  ${m}\n`);
      io.stdout(`\n${out.caveat}\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};
