import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { listFitItems } from "../../../db/fits.ts";
import { distinctValues, loadProfiles } from "../../../db/profiles.ts";
import type { PrecisionResult } from "../../analysis/precision/analysePrecision.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import { describeSelection, selectionFilter } from "../selection.ts";
import type { PrecisionRequest } from "./precisionRequest.ts";
import type { PrecisionGroupOutput, PrecisionTaskInput } from "./precisionTask.ts";

/** Read each group's profiles (one group per genotype unless one is chosen) and the per-embryo λ of stored fits. */
export function preparePrecisionInput(db: Db, request: PrecisionRequest): PrecisionTaskInput {
  const stored = distinctValues(db, "channel");
  const channels = request.channels ?? (stored.length === 1 ? stored : null);
  if (channels === null) {
    throw new UserError("choose-channel", `Several channels are stored (${stored.join(", ")}); choose one, or several for the joint positional error.`, { status: 400 });
  }
  for (const c of channels) if (!stored.includes(c)) throw new UserError("unknown-channel", `No profiles of channel "${c}" are stored (channels: ${stored.join(", ") || "none"}).`, { status: 404 });
  const genotypes = request.selection.genotype ? [request.selection.genotype] : (request.selection.genotypes ?? distinctValues(db, "genotype"));
  const groups = genotypes
    .map((genotype) => {
      const perChannel = channels.map((channel) => {
        const rows = loadProfiles(db, { ...selectionFilter({ ...request.selection, genotypes: undefined, genotype }), channel }).filter((p) => p.timeS === null);
        return {
          channel,
          profileIds: rows.map((r) => r.profileId),
          profiles: rows.map((r) => ({ embryo: r.embryo, positionUm: r.positionsUm, intensity: r.intensities, lengthUm: r.lengthUm ?? undefined })),
        };
      });
      const lambdas: Record<string, Record<string, number>> = {};
      for (const f of listFitItems(db, { genotype, channel: channels[0], model: "exponential" })) {
        if (f.status === "converged" && f.lambdaUm) lambdas[f.embryo] = { lambdaUm: f.lambdaUm.value };
      }
      return { name: genotype, channels: perChannel, embryoSummaries: lambdas };
    })
    .filter((g) => g.channels.every((c) => c.profiles.length > 0));
  if (groups.length === 0) {
    throw new UserError("nothing-selected", `No stored profiles of channel ${channels.map((c) => `"${c}"`).join(", ")} match ${describeSelection(request.selection)}.`, { status: 404 });
  }
  return { request, groups };
}

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
  };
}

export type PrecisionSummary = ReturnType<typeof precisionSummary>;

/** Store each group's analysis with its selection and settings and answer with the summaries. */
export function storePrecisionOutput(db: Db, input: PrecisionTaskInput, output: PrecisionGroupOutput[]) {
  return {
    results: output.map((g) => {
      const analysisId = storeAnalysis(db, {
        kind: "precision",
        selection: { ...input.request.selection, genotype: g.name, channels: g.channels },
        settings: input.request,
        engineVersion: ENGINE_VERSION,
        result: g,
        profileIds: g.profileIds,
      });
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
    }),
  };
}
