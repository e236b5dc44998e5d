/**
 * One embryo's fitted gradient parameters and metadata, as the integration
 * layer hands them over (read from the database). Plain values only: this
 * layer never reads files or SQL.
 */
export interface EmbryoRecord {
  /** Unique embryo label. */
  embryo: string;
  /** The label embryos are compared by unless another field is chosen: usually the genotype or line. */
  group: string;
  /** Fitted decay length λ in µm. */
  lambdaUm: number;
  /** Standard error of the fitted λ in µm, when the fit gave one. */
  lambdaSeUm?: number;
  /**
   * Intensity at the source end in a.u., as supplied. The background-corrected
   * amplitude is `amplitude − background`, so pass the amplitude including the
   * background offset (or leave `background` out when it is already removed).
   */
  amplitude?: number;
  /** Background offset in a.u. */
  background?: number;
  /** Boundary position (where the profile crosses a fixed threshold) in µm from the source. */
  boundaryUm?: number;
  /**
   * Set when the profile never crossed the threshold (then `boundaryUm` is
   * absent): 'before_start' — it starts below the threshold, so the boundary
   * lies before `boundaryLimitUm` (the first position); 'beyond_end' — it never
   * falls below it, so the boundary lies beyond `boundaryLimitUm` (the last
   * position). Such embryos are censored, not missing at random.
   */
  boundaryCensored?: "before_start" | "beyond_end";
  /** The measured position the censored boundary lies before or beyond, in µm. */
  boundaryLimitUm?: number;
  /** Embryo (or tissue) length in µm along the axis of the profile. */
  lengthUm?: number;
  /** Developmental stage: a number (e.g. cycle or somite count) or a label. */
  stage?: number | string;
  /** Age in s from a reference event chosen by the caller (e.g. fertilization, onset of expression). */
  ageS?: number;
  /** Relative source dosage of the line (1 = wild type; 0.5, 2, 4 for dosage series). */
  dosage?: number;
  channel?: string;
  session?: string;
  genotype?: string;
  /** Whether the profile fit converged; unconverged fits are never used. */
  converged: boolean;
  /** Curation status; embryos whose status is listed in the options' `excludeStatuses` are left out. */
  status?: string;
  /** Any further key → value the caller wants to group by. */
  metadata?: Record<string, string | number>;
}

/** An embryo that was left out of an analysis, and why. */
export interface ExcludedEmbryo {
  embryo: string;
  reason: string;
}
