import type { Estimate } from "../estimate.ts";
import { WarningList, type AnalysisWarning } from "../ensemble/analysisWarning.ts";
import { chooseGrid } from "../ensemble/chooseGrid.ts";
import { flipProfile } from "../ensemble/flipProfile.ts";
import { prepareEnsemble, type OrientationReport, type PreparedEnsemble } from "../ensemble/prepareEnsemble.ts";
import type { Coordinates, Profile } from "../ensemble/profile.ts";
import type { Matrix } from "../linalg/matrix.ts";
import { createRandom } from "../random/seededRandom.ts";
import { resampleIndices } from "../stats/bootstrap.ts";
import { onNodes, regionNodes, stateRegion, type AnalysisRegion, type RegionNodes } from "./analysisRegion.ts";
import { bootstrapEstimate, centredEstimate, withLengthUnits, type ScaledEstimate } from "./bootstrapEstimate.ts";
import { decodingMap, type DecodingMap } from "./decodingMap.ts";
import { ensembleMoments, rowMean } from "./ensembleMoments.ts";
import { gaussianInformation, jointGaussianInformation } from "./gaussianInformation.ts";
import { channelMoments, independentSigmaX, inverseCovarianceBias, jointSigmaX } from "./jointPositionalError.ts";
import { meanSlope, type MeanSlope } from "./meanSlope.ts";
import { positionalErrorCurve, type MaskReason } from "./positionalError.ts";
import { PrecisionOptions, type PrecisionOptionsInput, type PrecisionSettings } from "./precisionOptions.ts";
import { effectiveSigma, regionSigma, sigmaOnRegion } from "./regionSigma.ts";
import { levelEstimate, slopeLevels } from "./slopeLevels.ts";
import { smallNoiseInformation } from "./smallNoiseInformation.ts";

/** One channel (gene, gradient) measured in the same embryos as the others. */
export interface Channel {
  name: string;
  profiles: readonly Profile[];
}

export interface JointPrecisionResult {
  nEmbryos: number;
  embryos: string[];
  channels: string[];
  coords: Coordinates;
  unit: "um" | "fraction of length";
  gridX: number[];
  /** Joint σ_x from all channels with their covariance; null where masked. */
  sigmaX: (number | null)[];
  sigmaXCi95: ([number, number] | null)[];
  /** The same combination ignoring correlations between channels (Σ σ_c⁻²)^(−1/2), for comparison. */
  sigmaXIgnoringCorrelations: (number | null)[];
  /** Across-embryo correlation of each pair of channels at each grid position. */
  correlations: { channels: [string, string]; r: (number | null)[] }[];
  perChannel: {
    name: string;
    sigmaX: (number | null)[];
    smallNoise: number | null;
    direct: number | null;
  }[];
  mask: { reason: (MaskReason | null)[]; maskedPositions: number[] };
  /** Geometric mean of the joint σ_x over the region (as in the one-channel analysis); interval centred on the value. */
  sigmaXSummary: (ScaledEstimate & { method: "geometric mean over the region"; cappedPositions: number }) | null;
  positionalInformation: {
    /** The same stated region as every channel's own analysis. */
    region: AnalysisRegion;
    smallNoise: Estimate | null;
    /** Direct joint estimate; its CI uses the first `slowResamples` resamples. */
    direct: Estimate | null;
    note: string;
  };
  /** Expected inflation of σ_x⁻² from inverting a sample covariance, (n−1)/(n−K−2); see inverseCovarianceBias. */
  covarianceInversionBias: number | null;
  decoding: DecodingMap | null;
  orientation: { channel: string; report: OrientationReport }[];
  flipped: string[];
  /** Embryos missing from at least one channel, left out of the joint analysis. */
  excludedEmbryos: string[];
  normalisation: { channel: string; method: string; applied: boolean; reason: string | null }[];
  settings: {
    coords: Coordinates;
    grid: { spacing: number; range: [number, number]; points: number };
    normalisation: string;
    flip: "none" | "auto";
    derivative: { method: "savitzky-golay"; windowPoints: number; polynomialOrder: number };
    bootstrap: { resamples: number; seed: number; slowResamples: number };
    hermiteNodesPerAxis: number;
  };
  warnings: (AnalysisWarning & { count: number })[];
}

/**
 * Joint positional precision of several channels measured in the same embryos:
 * σ_x⁻² = ḡ′ᵀC⁻¹ḡ′ with the across-embryo covariance C (Dubuis et al. 2013, PNAS),
 * joint positional information (small-noise and direct), joint decoding.
 * Embryos are matched by label; an embryo flagged as reversed in most channels is
 * flipped in all of them (flip "auto"). Slopes are Savitzky–Golay (a single-channel
 * model curve does not apply). Options: {@link PrecisionOptions}.
 */
export function analyseJointPrecision(channels: readonly Channel[], options: PrecisionOptionsInput = {}): JointPrecisionResult {
  const settings: PrecisionSettings = PrecisionOptions.parse(options);
  const progress = settings.onProgress ?? (() => undefined);
  const K = channels.length;
  if (K === 0) throw new RangeError("analyseJointPrecision: no channels");
  const names = channels.map((c) => c.name);
  if (new Set(names).size !== K) throw new RangeError(`analyseJointPrecision: channel names must be unique, got ${names.join(", ")}`);
  const warnings = new WarningList();
  progress(0, "prepare");

  // Embryos present in every channel, in the order of the first channel.
  const labelSets = channels.map((c) => new Set(c.profiles.map((p) => p.embryo)));
  const embryos = channels[0].profiles.map((p) => p.embryo).filter((e) => labelSets.every((s) => s.has(e)));
  const allLabels = new Set(channels.flatMap((c) => c.profiles.map((p) => p.embryo)));
  const excludedEmbryos = [...allLabels].filter((e) => !embryos.includes(e));
  if (excludedEmbryos.length > 0)
    warnings.add("embryos-unmatched", `Left out (missing from some channel): ${excludedEmbryos.join(", ")}`, "Check the embryo labels of each channel.");
  const n = embryos.length;
  if (n < K + 3) throw new RangeError(`analyseJointPrecision: ${n} embryos measured in all ${K} channels; at least ${K + 3} are needed`);
  const aligned = channels.map((c) => {
    const byLabel = new Map(c.profiles.map((p) => [p.embryo, p]));
    return embryos.map((e) => byLabel.get(e) as Profile);
  });

  // Orientation: an embryo is reversed as a whole, so decide across channels.
  const request = { coords: settings.coords, spacing: settings.grid.spacing, range: settings.grid.range };
  const checks = aligned.map((profiles) => prepareEnsemble(profiles, { grid: request, normalisation: "none", flip: "none" }).orientation);
  const flips = new Set<string>();
  if (settings.flip === "auto")
    for (const e of embryos) {
      const votes = checks.filter((c) => c.flagged.includes(e)).length;
      if (2 * votes > K) flips.add(e);
      else if (votes > 0)
        warnings.add("orientation-split", `Embryo ${e} looks reversed in ${votes} of ${K} channels and was not flipped`, "Check its images; exclude it if its orientation is unclear.");
    }
  const flippedProfiles = aligned.map((profiles) => profiles.map((p) => (flips.has(p.embryo) ? flipProfile(p) : p)));
  const grid = chooseGrid(flippedProfiles.flat(), request);
  const prepared: PreparedEnsemble[] = aligned.map((profiles) =>
    prepareEnsemble(profiles, { grid: request, normalisation: settings.normalisation, flip: settings.flip }, { forcedFlips: flips, grid }),
  );
  prepared.forEach((p) => warnings.addAll(p.warnings.filter((w) => w.code !== "orientation-flagged" || settings.flip === "none")));
  if (settings.derivative.method === "model")
    warnings.add("model-slope-ignored", "A model slope describes one channel; the joint analysis uses Savitzky–Golay slopes", 'Set derivative.method to "savitzky-golay" to silence this.');

  const values = prepared.map((p) => p.values);
  const slopes: MeanSlope[] = values.map((v) =>
    meanSlope(grid.x, grid.spacing, v, { method: "savitzky-golay", windowPoints: settings.derivative.windowPoints, polynomialOrder: settings.derivative.polynomialOrder }),
  );
  const moments = channelMoments(values);
  const joint = jointSigmaX(slopes.map((s) => s.slope), moments.covariances);
  const independent = independentSigmaX(slopes.map((s) => s.slope), moments.covariances);

  const g = grid.x.length;
  const span = grid.x[g - 1] - grid.x[0];
  const reason = jointMask(joint, slopes.map((s) => s.slope), slopes.map((s) => s.slopeSe), moments.covariances, settings.mask, span);
  const jointRaw = Float64Array.from(joint);
  for (let k = 0; k < g; k++) if (reason[k] !== null) joint[k] = NaN;
  const masked = reason.map((r) => r !== null);
  const region = stateRegion(grid.x, grid.range, settings.region, settings.regionDefault);
  const nodes = regionNodes(grid.x, region);
  const last = nodes.x.length - 1;
  const jointOnRegion = (sigma: Float64Array, why: (MaskReason | null)[]) =>
    sigmaOnRegion(Float64Array.from(sigma, (v, k) => (why[k] === "no-variance" ? NaN : why[k] !== null ? Infinity : v)), region, nodes);
  const bias = inverseCovarianceBias(n, K);
  if (bias > 1.1)
    warnings.add(
      "few-embryos-for-channels",
      `${n} embryos for ${K} channels: inverting the sample covariance inflates σ_x⁻² by about ${Number.isFinite(bias) ? `${Math.round(100 * (bias - 1))}%` : "an unbounded factor"} on average, so joint σ_x reads low`,
      `Use at least ${K + 2 + Math.ceil((K + 1) / 0.1)} embryos for ${K} channels (bias below 10%).`,
    );

  const nodesPerAxis = K === 1 ? settings.information.hermiteNodes : Math.max(4, Math.ceil(settings.information.hermiteNodes / K));
  const directOf = (m: { means: Float64Array[]; covariances: Matrix[] }) =>
    jointGaussianInformation(nodes.x, m.means.map((v) => onNodes(nodes, v)), covariancesOnNodes(m.covariances, nodes), 0, last, nodesPerAxis);

  // Bootstrap over whole embryos.
  const resamples = settings.bootstrap.resamples;
  const slow = Math.min(resamples, settings.bootstrap.slowResamples);
  const repSigma = Array.from({ length: g }, () => new Float64Array(resamples));
  const repEffective = new Float64Array(resamples);
  const repSmall = new Float64Array(resamples);
  const repDirect = new Float64Array(slow);
  const random = createRandom(settings.bootstrap.seed);
  const every = Math.max(1, Math.floor(resamples / 100));
  for (let b = 0; b < resamples; b++) {
    const idx = resampleIndices(n, random);
    const m = channelMoments(values, idx);
    const resampledSlopes = slopes.map((sl) => rowMean(sl.embryoSlopes, idx));
    const resampledSe = slopes.map((sl) => Float64Array.from(ensembleMoments(sl.embryoSlopes, idx).sd, (v) => v / Math.sqrt(n)));
    const s = jointSigmaX(resampledSlopes, m.covariances);
    const why = jointMask(s, resampledSlopes, resampledSe, m.covariances, settings.mask, span);
    for (let k = 0; k < g; k++) repSigma[k][b] = why[k] === null ? s[k] : NaN;
    const onRegion = jointOnRegion(s, why).sigma;
    repEffective[b] = effectiveSigma(nodes.x, onRegion);
    repSmall[b] = smallNoiseInformation(nodes.x, onRegion, 0, last);
    if (b < slow) repDirect[b] = directOf(m);
    if ((b + 1) % every === 0) progress(0.05 + (0.85 * (b + 1)) / resamples, "bootstrap");
  }
  const reps = resamples > 0;

  const meanLengthUm = aligned[0].every((p) => p.lengthUm !== undefined) ? aligned[0].reduce((a, p) => a + (p.lengthUm as number), 0) / n : null;
  const umPerUnit = settings.coords === "absolute" ? 1 : meanLengthUm;
  const fractionPerUnit = settings.coords === "relative" ? 1 : meanLengthUm === null ? null : 1 / meanLengthUm;
  const jointRegion = jointOnRegion(jointRaw, reason);
  const effective = withLengthUnits(centredEstimate(effectiveSigma(nodes.x, jointRegion.sigma), reps ? repEffective : null, n, "log"), umPerUnit, fractionPerUnit);
  const sigmaXSummary: JointPrecisionResult["sigmaXSummary"] = effective
    ? { ...effective, method: "geometric mean over the region", cappedPositions: jointRegion.capped }
    : null;
  const perChannel = names.map((name, c) => {
    const sd = ensembleMoments(values[c]);
    const curve = positionalErrorCurve(grid.x, sd.sd, slopes[c].slope, slopes[c].slopeSe, settings.mask);
    const levels = slopeLevels(g, grid.spacing, values[c], { windowPoints: slopes[c].windowPoints, embryoSlopes: slopes[c].embryoSlopes }, slopes[c].polynomialOrder);
    const own = regionSigma(sd.sd, levels.map((l) => levelEstimate(l)), null, { minSlopeSnr: settings.mask.minSlopeSnr, embryos: n }, region, nodes);
    const finite = (v: number) => (Number.isFinite(v) ? v : null);
    return {
      name,
      sigmaX: Array.from(curve.sigmaX, finite),
      smallNoise: finite(smallNoiseInformation(nodes.x, own.sigma, 0, last)),
      direct: finite(gaussianInformation(nodes.x, onNodes(nodes, sd.mean), onNodes(nodes, sd.sd), 0, last, settings.information.hermiteNodes)),
    };
  });
  const correlations: JointPrecisionResult["correlations"] = [];
  for (let a = 0; a < K; a++)
    for (let c = a + 1; c < K; c++)
      correlations.push({
        channels: [names[a], names[c]],
        r: moments.covariances.map((cov) => {
          const d = Math.sqrt(cov[a][a] * cov[c][c]);
          return d > 0 ? cov[a][c] / d : null;
        }),
      });
  let decoding: DecodingMap | null = null;
  if (settings.decoding.enabled) {
    progress(0.93, "decoding");
    const needed = settings.decoding.leaveOneOut ? K + 3 : K + 2;
    if (n >= needed) decoding = decodingMap(grid.x, values, region.startIndex, region.endIndex, settings.decoding.leaveOneOut, settings.decoding.poolPoints ?? slopes[0].windowPoints);
  }
  progress(1, "done");
  const toNull = (v: number) => (Number.isFinite(v) ? v : null);
  return {
    nEmbryos: n,
    embryos,
    channels: names,
    coords: settings.coords,
    unit: settings.coords === "absolute" ? "um" : "fraction of length",
    gridX: Array.from(grid.x),
    sigmaX: Array.from(joint, toNull),
    sigmaXCi95: Array.from(joint, (v, k) => (Number.isFinite(v) && reps ? bootstrapEstimate(v, repSigma[k])?.ci95 ?? null : null)),
    sigmaXIgnoringCorrelations: Array.from(independent, (v, k) => (masked[k] ? null : toNull(v))),
    correlations,
    perChannel,
    mask: { reason, maskedPositions: Array.from(grid.x).filter((_, k) => masked[k]) },
    sigmaXSummary,
    positionalInformation: {
      region,
      smallNoise: centredEstimate(smallNoiseInformation(nodes.x, jointRegion.sigma, 0, last), reps ? repSmall : null, n, "linear"),
      direct: bootstrapEstimate(directOf(moments), slow > 0 ? repDirect : null),
      note:
        `Uniform prior over the region ${region.from}–${region.to} (${region.description}); positions whose slope no channel resolves count as carrying no information. Joint estimates need many more embryos than channels; direct estimates are biased upward ` +
        "with few embryos (Tkačik, Dubuis, Petkova, Gregor 2015, Genetics).",
    },
    covarianceInversionBias: Number.isFinite(bias) ? bias : null,
    decoding,
    orientation: names.map((channel, c) => ({ channel, report: { ...checks[c], flip: settings.flip, flipped: [...flips] } })),
    flipped: [...flips],
    excludedEmbryos,
    normalisation: prepared.map((p, c) => ({ channel: names[c], method: p.normalisation.method, applied: p.normalisation.applied, reason: p.normalisation.reason })),
    settings: {
      coords: settings.coords,
      grid: { spacing: grid.spacing, range: grid.range, points: g },
      normalisation: settings.normalisation,
      flip: settings.flip,
      derivative: { method: "savitzky-golay", windowPoints: slopes[0].windowPoints, polynomialOrder: slopes[0].polynomialOrder },
      bootstrap: { ...settings.bootstrap },
      hermiteNodesPerAxis: nodesPerAxis,
    },
    warnings: warnings.list(),
  };
}

/** Joint mask: no usable covariance, no channel resolving a slope, or σ_x too large. */
function jointMask(
  joint: Float64Array,
  slopes: readonly ArrayLike<number>[],
  slopeSe: readonly ArrayLike<number>[],
  covariances: readonly Matrix[],
  rule: { minSlopeSnr: number; maxSigmaFraction: number },
  span: number,
): (MaskReason | null)[] {
  return Array.from(joint, (v, k) => {
    const resolved = slopes.some((s, c) => Math.abs(s[k]) > rule.minSlopeSnr * slopeSe[c][k] && s[k] !== 0);
    if (!Number.isFinite(v) && covariances[k].some((row, c) => !(row[c] > 0))) return "no-variance";
    if (!resolved) return "shallow-slope";
    if (!(v <= rule.maxSigmaFraction * span)) return "imprecise";
    return null;
  });
}

/** Covariance matrices interpolated entry by entry onto the region's nodes, as the information integral does between grid points. */
function covariancesOnNodes(covariances: readonly Matrix[], nodes: RegionNodes): Matrix[] {
  return Array.from(nodes.x, (_, j) => {
    const k = nodes.lower[j];
    const t = nodes.t[j];
    if (t === 0) return covariances[k];
    if (t === 1) return covariances[k + 1];
    return covariances[k].map((row, r) => row.map((v, c) => (1 - t) * v + t * covariances[k + 1][r][c]));
  });
}
