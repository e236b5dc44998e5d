import { z } from "zod";

const positive = z.number().positive();

/**
 * Options of a build-up (time-course) fit; the single home of their defaults.
 * Times are measured from the onset of production (t = 0 when the source switched on).
 */
export const BuildUpFitOptions = z.strictObject({
  /** `semi-infinite` (default; closed form with an influx source) or `finite` with a closed far end at lengthUm. */
  domain: z.discriminatedUnion("kind", [z.strictObject({ kind: z.literal("semi-infinite") }), z.strictObject({ kind: z.literal("finite"), lengthUm: positive })]).default({ kind: "semi-infinite" }),
  /** `influx` at x = 0 (default), or production in a source region 0 < x < widthUm with a closed end at 0. */
  source: z.discriminatedUnion("kind", [z.strictObject({ kind: z.literal("influx") }), z.strictObject({ kind: z.literal("region"), widthUm: positive })]).default({ kind: "influx" }),
  /** Fit an additive background (a.u.) shared by all profiles; true by default (unstained tissue is rarely black). */
  background: z.boolean().default(true),
  /** Intensity in calibrated concentration units (then the amplitude is the flux j0) or arbitrary units. */
  calibrated: z.boolean().default(false),
  /** Positions (µm) at which to report the local accumulation time τ(x); 5 across the data when absent. */
  accumulationPositionsUm: z.array(z.number().min(0)).max(200).optional(),
  /**
   * Covariance of the estimates: `hc3` (default; robust to noise that grows with
   * intensity, as fluorescence noise does) or `ols` (s²(JᵀJ)⁻¹, constant noise).
   */
  covariance: z.enum(["hc3", "ols"]).default("hc3"),
  /** Points of the profile likelihood of k. */
  profilePoints: z.number().int().min(7).max(81).default(21),
  /** Finite volumes for the solver (finite domain or source region). */
  cells: z.number().int().min(50).max(4000).default(300),
});
export type BuildUpFitOptions = z.output<typeof BuildUpFitOptions>;
