import { z } from "zod";
import { modelNames } from "../models/steadyStateModel.ts";

const positive = z.number().positive();

/**
 * Every option of a steady-state fit and its default: the single home of
 * the defaults. Parse user input with `FitOptions.parse` (or `safeParse`, to
 * get issues with their paths); the numeric code receives the output type
 * {@link ResolvedFitOptions} and never checks for undefined again.
 */
export const FitOptions = z
  .strictObject({
    /** Steady-state model; "exponential" by default. */
    model: z.enum(modelNames).default("exponential"),
    /**
     * Fit only positions inside the window. Each end is given either in µm
     * (xMinUm, xMaxUm) or as a fraction of the embryo's length L
     * (xMinFractionOfLength, xMaxFractionOfLength: 0.1 means 0.1·L), since
     * embryos differ in length; not both for the same end. An end left open
     * is the end of the data, except that the start moves past a detected
     * source plateau or dip when `autoWindow` is true.
     */
    window: z
      .strictObject({
        xMinUm: z.number().optional(),
        xMaxUm: z.number().optional(),
        xMinFractionOfLength: z.number().min(0).max(1).optional(),
        xMaxFractionOfLength: z.number().min(0).max(1).optional(),
      })
      .refine((w) => w.xMinUm === undefined || w.xMaxUm === undefined || w.xMinUm < w.xMaxUm, {
        message: "window.xMinUm must be smaller than window.xMaxUm",
        path: ["xMaxUm"],
      })
      .refine((w) => w.xMinUm === undefined || w.xMinFractionOfLength === undefined, {
        message: "give the window's start either in µm or as a fraction of the embryo length, not both",
        path: ["xMinFractionOfLength"],
      })
      .refine((w) => w.xMaxUm === undefined || w.xMaxFractionOfLength === undefined, {
        message: "give the window's end either in µm or as a fraction of the embryo length, not both",
        path: ["xMaxFractionOfLength"],
      })
      .refine((w) => w.xMinFractionOfLength === undefined || w.xMaxFractionOfLength === undefined || w.xMinFractionOfLength < w.xMaxFractionOfLength, {
        message: "window.xMinFractionOfLength must be smaller than window.xMaxFractionOfLength",
        path: ["xMaxFractionOfLength"],
      })
      .optional(),
    /**
     * When the window's start is not given, start the fit past a source
     * plateau or dip (a flat or rising start of the profile) when one is
     * detected, and say so in the result; true by default. The `source`
     * model describes the source region itself and is never trimmed.
     */
    autoWindow: z.boolean().default(true),
    /**
     * How standard errors and intervals are computed: "hc3" (the default), a
     * heteroscedasticity-consistent sandwich covariance that stays valid when
     * the noise grows with the intensity, as fluorescence noise does; or
     * "classic", s²(JᵀJ)⁻¹, which assumes the same noise at every point.
     */
    errorModel: z.enum(["hc3", "classic"]).default("hc3"),
    /**
     * Parameters held at a given value instead of fitted. A value for a
     * parameter the chosen model does not have is ignored with a warning, so
     * the same options can serve a comparison of several models.
     */
    fixed: z
      .strictObject({
        /** Decay length λ (µm). */
        lambdaUm: positive.optional(),
        /** Width s of the producing region of the `source` model (µm), e.g. from a marker stain. */
        sourceWidthUm: positive.optional(),
        /** Offset x0 of the power-law models (µm). */
        x0Um: positive.optional(),
        /** Exponent m of the `power-free` model. */
        exponent: positive.optional(),
        /** Additive background B (a.u.), e.g. measured outside the embryo. Implies background: false. */
        background: z.number().optional(),
      })
      .prefault({}),
    /** Fit an additive background B; true by default. When false, B = fixed.background or 0. */
    background: z.boolean().default(true),
    /**
     * Point weights: "intensity" (the default), 1/(a + b·μ²) with μ the
     * fitted intensity and a, b estimated from the fit's own residuals,
     * because fluorescence noise has a constant part and a part that grows
     * with the signal (when the noise is constant, b ≈ 0 and the fit is
     * ordinary least squares); "none" (ordinary least squares);
     * "inverse-variance", 1/σ² from a variance array supplied with the
     * profile (e.g. the across-embryo variance of a mean profile);
     * "poisson", 1/μ, for photon-counting noise whose variance is
     * proportional to the signal.
     */
    weights: z.enum(["intensity", "none", "inverse-variance", "poisson"]).default("intensity"),
    /** Outlier-resistant loss, applied by iteratively reweighted least squares. */
    robust: z
      .strictObject({
        /** "none" (squared residuals, the default), "soft-l1" or "huber". */
        loss: z.enum(["none", "soft-l1", "huber"]).default("none"),
        /**
         * Residual size where the loss turns from quadratic to linear: in a.u.
         * without weights, in units of the weighted residual √w·r with them.
         * By default 1.345 × the robust SD (scaled MAD) of an ordinary fit's residuals.
         */
        scale: positive.optional(),
      })
      .prefault({}),
    /** Most Levenberg–Marquardt iterations on the nonlinear parameters; 200 by default. */
    maxIterations: z.int().min(1).max(100_000).default(200),
    /** Most reweighting rounds for robust or Poisson weights; 50 by default. */
    maxReweightings: z.int().min(1).max(10_000).default(50),
    tolerance: z
      .strictObject({
        /** Stop when no nonlinear parameter changes by more than this relative amount; 1e-10. */
        step: positive.default(1e-10),
        /** Stop when the predicted relative decrease of the RSS (and the actual one) falls below this; 1e-13. */
        reduction: positive.default(1e-13),
        /** Stop when the cosine between residual and every Jacobian column falls below this; 1e-10. */
        gradient: positive.default(1e-10),
      })
      .prefault({}),
  })
  // A fixed background is not fitted: say so in the resolved options.
  .transform((o) => (o.fixed.background !== undefined && o.background ? { ...o, background: false } : o));

/** Options as the user writes them (every field optional). */
export type FitOptionsInput = z.input<typeof FitOptions>;
/** Options after defaults: what the numeric code receives and every result records. */
export type ResolvedFitOptions = z.output<typeof FitOptions>;
