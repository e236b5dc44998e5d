import { z } from "zod";

const positive = z.number().positive();

/** Bleach geometry (µm); see {@link FrapGeometry}. */
export const FrapGeometrySchema = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("spot"), radiusUm: positive }),
  z.strictObject({ kind: z.literal("strip"), widthUm: positive }),
  z
    .strictObject({ kind: z.literal("rod"), fromUm: z.number().min(0), toUm: positive, lengthUm: positive })
    .refine((g) => g.fromUm < g.toUm && g.toUm <= g.lengthUm, { message: "the bleached strip must lie inside the rod: 0 ≤ from < to ≤ length", path: ["toUm"] }),
]);

/**
 * Options of a FRAP fit; the single home of their defaults. The intensity just
 * after the bleach and the mobile fraction are always fitted.
 */
export const FrapFitOptions = z.strictObject({
  geometry: FrapGeometrySchema,
  /**
   * Turnover during the recovery: `none` (default; D comes out too high if the
   * protein is degraded on the time scale of the recovery), `fixed` at a known
   * rate (1/s, e.g. ln2 over a measured half-life), or `fit`.
   */
  degradation: z
    .discriminatedUnion("mode", [z.strictObject({ mode: z.literal("none") }), z.strictObject({ mode: z.literal("fixed"), perS: positive }), z.strictObject({ mode: z.literal("fit") })])
    .default({ mode: "none" }),
});
export type FrapFitOptions = z.output<typeof FrapFitOptions>;
