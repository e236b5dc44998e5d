import type { StoredAnalysis } from "../../../db/analyses.ts";
import type { PrecisionResult } from "../../analysis/precision/analysePrecision.ts";
import type { AnalysisRegion } from "../../analysis/precision/analysisRegion.ts";
import type { Estimate } from "../../analysis/estimate.ts";
import type { PrecisionGroupOutput } from "./precisionTask.ts";

const estimate = (e: Estimate | null | undefined) => (e ? { value: e.value, se: e.se, ci95: e.ci95 } : null);

/** The stated region in the JSON answer; null only for analyses stored before regions were stated. */
export function informationRegion(region: AnalysisRegion | null | undefined, unit: string) {
  return region ? { from: region.from, to: region.to, unit, source: region.source ?? "longest unmasked run", description: region.description ?? "chosen from the mask (older engine)" } : null;
}

/**
 * The machine-readable summary of one group's precision analysis (lengths in µm unless coords are relative).
 * Stable names scripts read: information_region {from, to, unit}, positional_information_bits.small_noise and
 * .direct_extrapolated {value, ci95}, sigma_x_summary {value, ci95, method}.
 */
export function precisionSummary(analysisId: number, g: PrecisionGroupOutput, r: PrecisionResult, channel: string) {
  const pi = r.positionalInformation;
  const summary = r.sigmaXSummary ?? null;
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
    information_region: informationRegion(pi.region, r.unit),
    sigma_x_summary: summary
      ? {
          value: summary.value,
          se: summary.se,
          ci95: summary.ci95,
          method: summary.method,
          description: summary.description,
          unit: r.unit,
          um: summary.um,
          fraction_of_length: summary.fractionOfLength,
          positions_without_information: summary.cappedPositions,
          region_positions: summary.regionPositions,
        }
      : null,
    sigma_x_at: r.sigmaXAtPositions.map((s) => ({ position: s.position, value: s.sigmaX?.value ?? null, ci95: s.sigmaX?.ci95 ?? null })),
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
      small_noise: estimate(pi.smallNoise),
      direct_extrapolated: estimate(pi.directExtrapolated?.extrapolated),
      direct_raw: pi.direct ? { ...estimate(pi.direct)!, bias: pi.direct.bias, note: "all embryos, no correction: biased upward at finite n; not a headline" } : null,
      kernel_density: estimate(pi.kernelDensity),
      extrapolation: pi.directExtrapolated
        ? { bias_slope_bits_x_embryos: pi.directExtrapolated.biasSlope, spread: pi.directExtrapolated.spread ?? [], subsample_sizes: [...new Set(pi.directExtrapolated.points.map((p) => p.embryos))] }
        : null,
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
          information_region: informationRegion(g.joint.positionalInformation.region, g.joint.unit),
          sigma_x_summary: g.joint.sigmaXSummary
            ? { value: g.joint.sigmaXSummary.value, se: g.joint.sigmaXSummary.se, ci95: g.joint.sigmaXSummary.ci95, method: g.joint.sigmaXSummary.method }
            : null,
          positional_information_bits: {
            small_noise: estimate(g.joint.positionalInformation.smallNoise),
            direct_raw: estimate(g.joint.positionalInformation.direct),
          },
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
