import { runFitTask } from "../services/fits/fitTask.ts";
import { FitRequest } from "../services/fits/fitRequest.ts";
import { prepareFitInput, storeFitOutput } from "../services/fits/fitService.ts";
import { UserError } from "../userError.ts";
import { numberOption, valueWithErrorOption } from "./cliNumbers.ts";
import { windowOption } from "./windowOption.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { formatEstimate } from "./formatEstimate.ts";
import { formatTable } from "./formatTable.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { progressReporter } from "./progressReporter.ts";
import { zodToUserError } from "./zodToUserError.ts";
import { genotypeSelection } from "./groupOptions.ts";

export const fitCommand: Command = {
  name: "fit",
  summary: "fit SDD steady-state models to stored profiles (decay length λ with its CI)",
  help: `Usage: morphogauge fit [--genotype G] [--channel C] [--model M] [--window A:B] [--global] [--diffusion D±SE] [options]

Fits each selected profile and stores the fit with its options. Refitting with
the same options replaces the earlier fit; other options add a new one. Every
fit belongs to a named fit setting (the model with its window, weights,
background and fixed parameters); group analyses use one setting for all groups
(--fits NAME). "morphogauge fits settings" lists the stored settings.

  --genotype G[,G2…]    only these genotypes
  --channel C           only this channel
  --embryo E            only this embryo
  --model M             exponential | finite | source | power | power-free | all
                        (default exponential; several comma-separated; "all" ranks them by AICc)
  --window A:B          fit only positions A ≤ x ≤ B, each end in µm (30) or as a
                        fraction of the embryo's length (0.1L); A: or :B leave one end
                        open, e.g. 30: or 0.1L:0.8L. Without a start, the fit starts
                        past a source plateau or dip when one is detected (and says so)
  --no-auto-window      fit from the first point even when a source plateau is detected
  --no-background       fit without an additive background
  --source-width UM     hold the source width of the "source" model at this value
  --weights W           intensity | none | poisson (default intensity: 1/(a + b·μ²),
                        estimated from the residuals, for noise that grows with intensity)
  --error-model E       hc3 | classic (default hc3: sandwich standard errors that hold
                        when the noise varies; classic: s²(JᵀJ)⁻¹, constant noise)
  --robust L            none | soft-l1 | huber (default none): down-weight outlying points
  --as NAME             name the fit setting of these fits, e.g. posterior-window (NAME-model with
                        several models); default: the setting's stored name, or one made from
                        the options (e.g. exponential-30um-on)
  --global              also fit each genotype × channel group with one shared λ
  --diffusion D±SE      a D measured elsewhere (e.g. FRAP), in µm²/s, e.g. 0.8±0.1: adds
                        k, half-life, source flux and local accumulation time
  --tau-at X,Y          positions (µm) for the local accumulation time (with --diffusion)

A single steady-state profile determines λ = √(D/k) only; D and k separately
need a second measurement (see README, "Reading the results").
${COMMON_HELP}`,
  options: {
    ...COMMON_OPTIONS,
    genotype: { type: "string" },
    channel: { type: "string" },
    embryo: { type: "string" },
    model: { type: "string" },
    window: { type: "string" },
    "no-auto-window": { type: "boolean", default: false },
    "error-model": { type: "string" },
    "no-background": { type: "boolean", default: false },
    "source-width": { type: "string" },
    weights: { type: "string" },
    robust: { type: "string" },
    as: { type: "string" },
    global: { type: "boolean", default: false },
    diffusion: { type: "string" },
    "tau-at": { type: "string" },
  },
  async run(values, _positionals, io) {
    const window = windowOption("window", values.window as string | undefined);
    const sourceWidth = numberOption("source-width", values["source-width"] as string | undefined);
    const diffusion = valueWithErrorOption("diffusion", values.diffusion as string | undefined);
    const tauAt = ((values["tau-at"] as string | undefined) ?? "")
      .split(",")
      .filter((s) => s.trim() !== "")
      .map((s) => numberOption("tau-at", s)!);
    if (tauAt.length > 0 && !diffusion) throw new UserError("bad-option", "--tau-at needs --diffusion: the accumulation time depends on D");
    const parsed = FitRequest.safeParse({
      selection: { ...genotypeSelection(values.genotype as string | undefined), channel: values.channel, embryo: values.embryo },
      models: ((values.model as string | undefined) ?? "exponential").split(",").map((m) => m.trim()),
      options: {
        ...(window ? { window } : {}),
        ...(values["no-auto-window"] ? { autoWindow: false } : {}),
        ...(values["error-model"] ? { errorModel: values["error-model"] } : {}),
        ...(values["no-background"] ? { background: false } : {}),
        ...(sourceWidth !== undefined ? { fixed: { sourceWidthUm: sourceWidth } } : {}),
        ...(values.weights ? { weights: values.weights } : {}),
        ...(values.robust ? { robust: { loss: values.robust } } : {}),
      },
      as: values.as,
      global: values.global,
      diffusion: diffusion ? { valueUm2PerS: diffusion.value, seUm2PerS: diffusion.se } : undefined,
      accumulationPositionsUm: tauAt,
    });
    if (!parsed.success) throw zodToUserError(parsed.error, { models: "model" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const input = prepareFitInput(db, parsed.data);
      const progress = progressReporter(io, "fitting");
      const output = runFitTask(input, progress.update);
      progress.done();
      const result = storeFitOutput(db, input, output);
      if (values.json) {
        io.stdout(JSON.stringify(result, null, 2) + "\n");
        return 0;
      }
      io.stdout(
        formatTable(
          ["embryo", "genotype", "channel", "model", "λ (µm) ± SE [95% CI]", "window (µm)", "AICc weight", "status"],
          result.fits.map((f) => [
            f.embryo,
            f.genotype,
            f.channel,
            f.model,
            f.lambda_um ? formatEstimate(f.lambda_um) : f.parameters.x0Um ? `x0 ${formatEstimate(f.parameters.x0Um)}` : "—",
            f.window ? `${formatUm(f.window.from_um)}–${formatUm(f.window.to_um)}${f.window.start.startsWith("past-source") ? " *" : ""}` : "—",
            f.akaike_weight === null ? "" : f.akaike_weight.toFixed(2),
            f.status === "converged" ? "ok" : `${f.status}: ${f.message}`,
          ]),
        ),
      );
      if (result.fits.some((f) => f.window?.start.startsWith("past-source")))
        io.stdout("* the fit starts past a detected source plateau or dip; give --window 0: (or --no-auto-window) to fit from the first point\n");
      const errorModels = [...new Set(result.fits.map((f) => f.error_model.description))];
      io.stdout(`Error model: ${errorModels.join(" | ")}\n`);
      const warned = result.fits.filter((f) => f.warnings.length > 0);
      if (warned.length > 0) {
        io.stdout(`\nWarnings (${warned.length} fit(s)):\n`);
        for (const f of warned) for (const w of f.warnings) io.stdout(`  ${f.embryo} (${f.model}): ${w}\n`);
      }
      for (const g of result.groups) {
        const p = g.model_preference;
        io.stdout(`\n${g.genotype} / ${g.channel}: ${g.warning ? `WARNING: ${g.warning}` : p.message}`);
      }
      if (result.groups.length > 0) io.stdout("\n");
      for (const g of result.global) {
        const pe = g.per_embryo;
        io.stdout(
          `\nglobal ${g.model} fit, ${g.genotype} / ${g.channel} (${g.n_embryos} embryos): λ = ${formatEstimate(g.lambda_um, "µm")}` +
            (pe.mean_um !== null ? `; per-embryo λ mean ${pe.mean_um.toFixed(1)} µm, SD ${pe.sd_um?.toFixed(1) ?? "—"} µm, median ${pe.median_um?.toFixed(1)} µm` : "") +
            (g.window ? `\n  window ${g.window.how_chosen}` : "") +
            "\n",
        );
      }
      for (const st of result.settings) io.stdout(`\nFit setting ${st.name}${st.renamed ? " (renamed)" : ""}: ${st.description}\n`);
      const failed = result.fits.filter((f) => f.status !== "converged").length;
      io.stdout(`\n${result.fits.length} fits stored${failed ? `, ${failed} not converged (see status)` : ""}.\nNote: ${result.caveat}\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};

function formatUm(v: number): string {
  return Number.isInteger(v) ? String(v) : v.toFixed(1);
}
