import { z } from "zod";
import { BuildUpFitOptions } from "../../analysis/dynamics/buildUp/buildUpFitOptions.ts";
import { FrapFitOptions } from "../../analysis/dynamics/frap/frapFitOptions.ts";
import { Selection } from "../selection.ts";

/** A build-up (time-course) fit of stored profiles that carry a time. */
export const TimeCourseRequest = z.strictObject({
  selection: Selection.default({}),
  options: BuildUpFitOptions.default(BuildUpFitOptions.parse({})),
});
export type TimeCourseRequest = z.output<typeof TimeCourseRequest>;

/** FRAP recovery tables (their text) and how to fit them. */
export const FrapRequest = z.strictObject({
  files: z.array(z.strictObject({ name: z.string().min(1).max(500), text: z.string().max(20_000_000) })).min(1).max(500),
  options: FrapFitOptions,
});
export type FrapRequest = z.output<typeof FrapRequest>;

/** Combine a stored FRAP analysis with a stored global fit of a genotype group. */
export const CombineRequest = z.strictObject({
  frapAnalysisId: z.number().int().positive(),
  genotype: z.string().min(1),
  channel: z.string().min(1).optional(),
  /** Steady-state model of the global fit to use; the newest SDD model fitted when absent. */
  model: z.enum(["exponential", "finite", "source"]).optional(),
  /** Positions (µm) for τ(x); 0, λ, 2λ, 3λ when absent. */
  accumulationPositionsUm: z.array(z.number().min(0)).max(200).optional(),
});
export type CombineRequest = z.output<typeof CombineRequest>;

/** A what-if build-up: the model run forward from c = 0. */
export const SimulateRequest = z.strictObject({
  diffusionUm2PerS: z.number().positive().max(1e4),
  degradationPerS: z.number().positive().max(10),
  /** Influx j0 at x = 0 (a.u.·µm/s); with a source region, the total production per unit cross-section. */
  flux: z.number().positive().default(1),
  lengthUm: z.number().positive().max(1e5),
  untilS: z.number().positive().max(1e9),
  /** Production in [fromUm, toUm] instead of an influx at 0 (rate flux/(to − from), closed end at 0). */
  source: z.strictObject({ fromUm: z.number().min(0), toUm: z.number().positive() }).refine((s) => s.toUm > s.fromUm, { message: "the source region must end after it starts", path: ["toUm"] }).optional(),
  /** How many profiles to report, evenly spaced in time up to untilS. */
  profiles: z.number().int().min(1).max(50).default(6),
  /** Finite volumes along the length. */
  cells: z.number().int().min(20).max(4000).default(200),
  /** Positions (µm) for τ(x); 8 across the length when absent. */
  accumulationPositionsUm: z.array(z.number().min(0)).max(200).optional(),
});
export type SimulateRequest = z.output<typeof SimulateRequest>;
