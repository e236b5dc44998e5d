import { z } from "zod";
import { FitOptions, type ResolvedFitOptions } from "../../analysis/fit/fitOptions.ts";
import { modelNames, type ModelName } from "../../analysis/models/steadyStateModel.ts";
import { UserError } from "../../userError.ts";
import { Selection } from "../selection.ts";

/** What a caller asks of a fit run: which profiles, which models, which options. */
export const FitRequest = z.object({
  selection: Selection.default({}),
  /** Models to fit; "all" fits every model and ranks them by AICc. */
  models: z.array(z.enum([...modelNames, "all"])).min(1).default(["exponential"]),
  /** Fit options shared by every model (window, fixed parameters, weights, background, robust loss). */
  options: z.record(z.string(), z.unknown()).default({}),
  /**
   * Name for the fit setting these fits belong to (model plus options), e.g.
   * "posterior-window"; NAME-model for each model when several are fitted.
   * Without it, an existing setting keeps its name and a new one gets a readable generated name.
   */
  as: z.string().trim().min(1).max(48).optional(),
  /** Also fit each genotype × channel group globally: one shared λ, per-embryo amplitude and background. */
  global: z.boolean().default(false),
  /** An independently measured D (e.g. FRAP) in µm²/s with its standard error, for k, half-life, flux and τ(x). */
  diffusion: z.object({ valueUm2PerS: z.number().positive(), seUm2PerS: z.number().min(0).nullable().default(null) }).optional(),
  /**
   * Also fit every other model to each profile's window and report, per
   * genotype × channel group, which model AICc prefers (model_preference),
   * with a warning when it is not the fitted one; true by default.
   */
  checkModels: z.boolean().default(true),
  /** Positions (µm) at which to report the local accumulation time τ(x) when D is given. */
  accumulationPositionsUm: z.array(z.number().min(0)).max(50).default([]),
});
export type FitRequest = z.output<typeof FitRequest>;

export function resolveModels(models: FitRequest["models"]): ModelName[] {
  return models.includes("all") ? [...modelNames] : [...new Set(models as ModelName[])];
}

/** Validate the shared options once per model, naming bad fields as `options.<field>`. */
export function resolveFitOptions(request: FitRequest): Record<ModelName, ResolvedFitOptions> {
  const out = {} as Record<ModelName, ResolvedFitOptions>;
  for (const model of resolveModels(request.models)) {
    const parsed = FitOptions.safeParse({ ...request.options, model });
    if (!parsed.success) {
      const issues = parsed.error.issues.map((i) => ({ path: ["options", ...i.path].join("."), message: i.message }));
      throw new UserError("invalid-fit-options", `Invalid fit options: ${issues.map((i) => `${i.path}: ${i.message}`).join("; ")}`, { issues });
    }
    out[model] = parsed.data;
  }
  return out;
}
