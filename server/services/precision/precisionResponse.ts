import type { StoredAnalysis } from "../../../db/analyses.ts";
import type { PrecisionResult } from "../../analysis/precision/analysePrecision.ts";
import type { PrecisionGroupOutput } from "./precisionTask.ts";

/** The machine-readable summary of one group's precision analysis (lengths in µm unless coords are relative). */
export function precisionSummary(analysisId: number, g: PrecisionGroupOutput, r: PrecisionResult, channel: string) {
  const pi = r.positionalInformation;
  return {
    analysis_id: analysisId,
    group: g.name,
    channel,
    n_embryos: r.nEmbryos,
    coords: r.coords,
    unit: r.unit,
    x: r.gridX,
    mean_intensity: r.meanIntensity,
    sd_intensity: r.sdIntensity,
    sigma_x: r.sigmaX,
    sigma_x_ci95: r.sigmaXCi95,
    sigma_x_expected_relative_error: r.sigmaXExpectedRelativeError,
    masked_positions: r.mask.maskedPositions.length,
    min_sigma_x: r.minSigmaX
      ? { value: r.minSigmaX.value, se: r.minSigmaX.se, position: r.minSigmaX.position, ci95: r.minSigmaX.ci95, fraction_of_length: r.minSigmaX.fractionOfLength }
      : null,
    sigma_x_at: r.sigmaXAtPositions.map((s) => ({ position: s.position, value: s.sigmaX?.value ?? null, ci95: s.sigmaX?.ci95 ?? null })),
    mean_sigma_x: r.meanSigmaX ? { value: r.meanSigmaX.value, ci95: r.meanSigmaX.ci95 } : null,
    boundary: r.boundary
      ? {
          threshold: r.boundary.threshold,
          threshold_source: r.boundary.thresholdSource,
          positions: Object.fromEntries(r.boundary.positions.map((p) => [p.embryo, p.position])),
          never_cross: r.boundary.neverCross,
          mean_position: r.boundary.meanPosition,
          sd: r.boundary.sd?.value ?? null,
          sd_ci95: r.boundary.sd?.ci95 ?? null,
          sd_bootstrap_ci95: r.boundary.sdBootstrapCi95,
          sigma_x_at_threshold: r.boundary.sigmaXAtThreshold ? { value: r.boundary.sigmaXAtThreshold.value, ci95: r.boundary.sigmaXAtThreshold.ci95 } : null,
          sd_over_sigma_x: r.boundary.ratio,
        }
      : null,
    positional_information_bits: {
      small_noise: pi.smallNoise?.value ?? null,
      direct: pi.direct?.value ?? null,
      direct_extrapolated: pi.directExtrapolated?.extrapolated ?? null,
      kernel_density: pi.kernelDensity?.value ?? null,
      ci95: { small_noise: pi.smallNoise?.ci95 ?? null, direct: pi.direct?.ci95 ?? null, kernel_density: pi.kernelDensity?.ci95 ?? null },
      region: pi.region,
      note: pi.note,
    },
    normalisation: r.normalisation.method,
    derivative: r.settings.derivative.description,
    flipped: r.orientation,
    decoding: r.decoding,
    outliers: r.outliers,
    warnings: r.warnings,
    settings: r.settings,
    /** Embryos and profiles left out by an exclusion, with the reasons. */
    left_out: g.left_out ?? [],
  };
}

export type PrecisionSummary = ReturnType<typeof precisionSummary>;

/**
 * One group's answer in the precision job's `results`: the first channel's
 * summary, the other channels' summaries and the joint positional error.
 * The job and the figure and export endpoints answer with this same function.
 */
export function precisionGroupResponse(analysisId: number, g: PrecisionGroupOutput) {
  return {
    ...precisionSummary(analysisId, g, g.perChannel[0].result, g.perChannel[0].channel),
    per_channel: g.perChannel.slice(1).map((c) => precisionSummary(analysisId, g, c.result, c.channel)),
    joint: g.joint
      ? {
          channels: g.joint.channels,
          n_embryos: g.joint.nEmbryos,
          x: g.joint.gridX,
          sigma_x: g.joint.sigmaX,
          sigma_x_ci95: g.joint.sigmaXCi95,
          sigma_x_ignoring_correlations: g.joint.sigmaXIgnoringCorrelations,
          min_sigma_x: g.joint.minSigmaX ? { value: g.joint.minSigmaX.value, position: g.joint.minSigmaX.position, ci95: g.joint.minSigmaX.ci95 } : null,
          positional_information_bits: { small_noise: g.joint.positionalInformation.smallNoise?.value ?? null, direct: g.joint.positionalInformation.direct?.value ?? null, ci95: { small_noise: g.joint.positionalInformation.smallNoise?.ci95 ?? null, direct: g.joint.positionalInformation.direct?.ci95 ?? null } },
          note: g.joint.positionalInformation.note,
        }
      : null,
    slope_model: g.slopeModel,
  };
}

export type PrecisionGroupResponse = ReturnType<typeof precisionGroupResponse>;

/** The job's answer for a stored precision analysis (one analysis per group). */
export function storedPrecisionResponse(analysis: Pick<StoredAnalysis, "id" | "result">): PrecisionGroupResponse {
  return precisionGroupResponse(analysis.id, analysis.result as PrecisionGroupOutput);
}
