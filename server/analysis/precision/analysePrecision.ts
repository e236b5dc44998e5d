import type { Estimate } from "../estimate.ts";
import { WarningList, type AnalysisWarning } from "../ensemble/analysisWarning.ts";
import type { VarianceStep } from "../ensemble/acrossEmbryoVariance.ts";
import { flagOutliers, type OutlierReport } from "../ensemble/flagOutliers.ts";
import { interpolateLinear } from "../ensemble/interpolateLinear.ts";
import type { EmbryoNormalisation, NormalisationMethod } from "../ensemble/normaliseEnsemble.ts";
import { prepareEnsemble, type OrientationReport, type PreparedEnsemble } from "../ensemble/prepareEnsemble.ts";
import type { Coordinates, Profile } from "../ensemble/profile.ts";
import { createRandom } from "../random/seededRandom.ts";
import { onNodes, regionNodes, stateRegion, type AnalysisRegion } from "./analysisRegion.ts";
import { bootstrapEstimate, centredEstimate, withLengthUnits, type BootstrapEstimate, type ReplicateUse, type ScaledEstimate } from "./bootstrapEstimate.ts";
import { bootstrapPrecision, type BootstrapReplicates } from "./bootstrapPrecision.ts";
import { boundaryCrossings, firstCrossing } from "./boundaryVariability.ts";
import { decodingMap, type DecodingMap } from "./decodingMap.ts";
import { ensembleMoments } from "./ensembleMoments.ts";
import { gaussianInformation } from "./gaussianInformation.ts";
import { kernelInformation } from "./kernelInformation.ts";
import { meanSlope } from "./meanSlope.ts";
import { positionalErrorCurve, type MaskReason } from "./positionalError.ts";
import { PrecisionOptions, type PrecisionOptionsInput, type PrecisionSettings } from "./precisionOptions.ts";
import { sampleSizeExtrapolation, type SampleSizeExtrapolation } from "./sampleSizeExtrapolation.ts";
import { scalingComparison, type ScalingComparison } from "./scalingComparison.ts";
import { effectiveSigma, regionSigma } from "./regionSigma.ts";
import { levelEstimate, slopeLevels } from "./slopeLevels.ts";
import { sigmaAt } from "./sigmaSummaries.ts";
import { smallNoiseInformation } from "./smallNoiseInformation.ts";

/** Threshold crossings across embryos compared with σ_x at the boundary. */
export interface BoundaryResult {
  threshold: number;
  thresholdSource: "given" | "mean level at position";
  /** Position whose mean level set the threshold (null when the threshold was given). */
  levelPosition: number | null;
  /** Each embryo's first crossing from the source end (grid units), null if it never crosses. */
  positions: { embryo: string; position: number | null }[];
  neverCross: string[];
  meanPosition: number | null;
  /** SD across embryos of the crossing positions; ci95 from the chi-square distribution. */
  sd: ScaledEstimate | null;
  /** Bootstrap percentile 95% CI of the same SD, resampling embryos. */
  sdBootstrapCi95: [number, number] | null;
  /** Where the group's mean profile first crosses the threshold. */
  meanProfileCrossing: number | null;
  /** σ_x at meanProfileCrossing, bootstrap CI; for small noise it should equal the SD (Gregor et al. 2007). */
  sigmaXAtThreshold: ScaledEstimate | null;
  /** sd / sigmaXAtThreshold. */
  ratio: number | null;
}

/** The headline positional error: one number for the stated region, with an interval that contains it. */
export interface SigmaXSummary extends ScaledEstimate {
  method: "geometric mean over the region";
  /** What the number is and how unreliable positions inside the region were handled, in words. */
  description: string;
  /** Grid positions inside the region counted as carrying no positional information (σ_x set to L/√(2πe)). */
  cappedPositions: number;
  /** Grid positions inside the region without spread across embryos, filled from their neighbours. */
  filledPositions: number;
  /** Grid positions inside the region. */
  regionPositions: number;
}

export interface PositionalInformationResult {
  /** Region integrated over, with a uniform prior on it: the same for every summary of this result. */
  region: AnalysisRegion;
  /** Small-noise approximation (bits) from the region's σ_x; interval centred on the value (bootstrap SE, t quantile). */
  smallNoise: BootstrapEstimate | null;
  /** Direct estimate with Gaussian P(c|x) (bits) from all embryos: biased upward at finite n; percentile interval. Not a headline. */
  direct: BootstrapEstimate | null;
  /** The headline direct estimate: extrapolated to infinitely many embryos, with its interval from the subsample spread; null below 12 embryos or when not requested. */
  directExtrapolated: SampleSizeExtrapolation | null;
  /** Direct estimate with kernel-density P(c|x) (bits); null unless requested. */
  kernelDensity: BootstrapEstimate | null;
  note: string;
}

export interface PrecisionResult {
  nEmbryos: number;
  embryos: string[];
  coords: Coordinates;
  /** Unit of positions and σ_x in this result: µm (absolute) or fraction of embryo length (relative). */
  unit: "um" | "fraction of length";
  /** Mean embryo length in µm, null when not every profile states it. */
  meanLengthUm: number | null;
  gridX: number[];
  /** Mean profile and across-embryo SD after normalisation. */
  meanIntensity: number[];
  sdIntensity: number[];
  /** dc̄/dx used for σ_x, per grid unit. */
  slope: number[];
  /** σ_x at each grid position; null where masked. */
  sigmaX: (number | null)[];
  /** Bootstrap percentile 95% band of σ_x; null where masked or without bootstrap. */
  sigmaXCi95: ([number, number] | null)[];
  /** Expected relative error of σ_x from n embryos, 1/√(2(n−1)) (Gregor et al. 2007). */
  sigmaXExpectedRelativeError: number;
  mask: {
    reason: (MaskReason | null)[];
    maskedPositions: number[];
    counts: Record<MaskReason, number>;
    rule: { minSlopeSnr: number; maxSigmaFraction: number };
  };
  /** Headline σ_x over the stated region (see SigmaXSummary); null when σ_x is unusable everywhere in it. */
  sigmaXSummary: SigmaXSummary | null;
  sigmaXAtPositions: { position: number; sigmaX: ScaledEstimate | null }[];
  boundary: BoundaryResult | null;
  positionalInformation: PositionalInformationResult;
  decoding: DecodingMap | null;
  scaling: ScalingComparison | null;
  outliers: OutlierReport;
  normalisation: {
    method: NormalisationMethod;
    applied: boolean;
    reason: string | null;
    iterations: number;
    converged: boolean;
    perEmbryo: EmbryoNormalisation[];
    /** Across-embryo variance before and after each preparation step. */
    varianceSteps: VarianceStep[];
  };
  orientation: OrientationReport;
  settings: {
    coords: Coordinates;
    grid: { spacing: number; spacingSource: string; range: [number, number]; rangeSource: string; points: number };
    normalisation: NormalisationMethod;
    flip: "none" | "auto";
    derivative: {
      method: "savitzky-golay" | "model";
      windowPoints: number;
      polynomialOrder: number;
      description: string;
      /** Model only: RMS of (model − mean)/(SE of the mean) over the grid. */
      modelDeviationRms: number | null;
      /** Model only: whether bootstrap resamples refit the model (true) or hold its slope fixed. */
      refitInResamples: boolean | null;
    };
    mask: { minSlopeSnr: number; maxSigmaFraction: number };
    /** The region as requested (null when the default was used) and how the default is made. */
    region: [number, number] | null;
    regionDefault: PrecisionSettings["regionDefault"];
    bootstrap: { resamples: number; seed: number; slowResamples: number };
    information: PrecisionSettings["information"];
    decoding: PrecisionSettings["decoding"];
    outlierThreshold: number;
  };
  warnings: (AnalysisWarning & { count: number })[];
}

const STAGES = { prepare: 0.02, bootstrapStart: 0.08, bootstrapEnd: 0.85, extrapolate: 0.88, decoding: 0.93, scaling: 0.97 };

/**
 * Positional precision of a group of replicate embryos: positional error σ_x(x)
 * with bootstrap bands, boundary variability, positional information (small-noise
 * and direct), a decoding map and length scaling, from one call.
 * Options are validated by {@link PrecisionOptions} (throws its ZodError when invalid);
 * structurally invalid profiles throw a RangeError naming the embryo.
 */
export function analysePrecision(group: readonly Profile[], options: PrecisionOptionsInput = {}): PrecisionResult {
  return runPrecision(group, PrecisionOptions.parse(options));
}

/** The same for options already parsed by {@link PrecisionOptions} (e.g. validated by the API layer). */
export function runPrecision(group: readonly Profile[], settings: PrecisionSettings): PrecisionResult {
  const progress = settings.onProgress ?? (() => undefined);
  if (group.length < 3) throw new RangeError(`analysePrecision: needs at least 3 embryos, got ${group.length}`);
  progress(0, "prepare");
  const warnings = new WarningList();
  const prepared = prepareEnsemble(group, {
    grid: { coords: settings.coords, spacing: settings.grid.spacing, range: settings.grid.range },
    normalisation: settings.normalisation,
    flip: settings.flip,
  });
  warnings.addAll(prepared.warnings);
  const { grid, values, embryos } = prepared;
  const n = values.length;
  const lengths = prepared.lengthsUm;
  const meanLengthUm = lengths.every((l) => l !== null) ? (lengths as number[]).reduce((a, b) => a + b, 0) / n : null;
  const umPerUnit = settings.coords === "absolute" ? 1 : meanLengthUm;
  const fractionPerUnit = settings.coords === "relative" ? 1 : meanLengthUm === null ? null : 1 / meanLengthUm;
  const scaled = (e: Estimate | null): ScaledEstimate | null => withLengthUnits(e, umPerUnit, fractionPerUnit);

  progress(STAGES.prepare, "positional error");
  const moments = ensembleMoments(values);
  const slope = meanSlope(grid.x, grid.spacing, values, settings.derivative);
  const curve = positionalErrorCurve(grid.x, moments.sd, slope.slope, slope.slopeSe, settings.mask);
  const masked = curve.mask.map((r) => r !== null);
  const region = stateRegion(grid.x, grid.range, settings.region, settings.regionDefault);
  const nodes = regionNodes(grid.x, region);
  const sigmaRule = { minSlopeSnr: settings.mask.minSlopeSnr, embryos: n };
  const levels = slopeLevels(grid.x.length, grid.spacing, values, { windowPoints: slope.windowPoints, embryoSlopes: slope.embryoSlopes }, slope.polynomialOrder);
  const inRegion = regionSigma(moments.sd, levels.map((l) => levelEstimate(l)), slope.method === "model" ? slope.slope : null, sigmaRule, region, nodes);
  const modelDeviationRms = slope.modelValue ? modelDeviation(slope.modelValue, moments.mean, moments.sd, n) : null;
  noteSettings(warnings, settings, prepared, curve.mask, modelDeviationRms, n);
  noteRegion(warnings, region, inRegion);

  const boundarySetup = chooseThreshold(settings, grid.x, moments.mean, region, warnings);
  const crossings = boundarySetup ? boundaryCrossings(grid.x, embryos, values, boundarySetup.threshold) : null;
  const meanProfileCrossing = boundarySetup ? firstCrossing(grid.x, moments.mean, boundarySetup.threshold) : null;

  const random = createRandom(settings.bootstrap.seed);
  let replicates: BootstrapReplicates | null = null;
  if (settings.bootstrap.resamples > 0) {
    progress(STAGES.bootstrapStart, "bootstrap");
    replicates = bootstrapPrecision(
      {
        gridX: grid.x,
        values,
        levels,
        model: slope.method === "model" ? { refit: settings.derivative.refit ?? null, fixed: slope.slope } : null,
        mask: settings.mask,
        region,
        nodes,
        regionValues: settings.information.kernelDensity ? values.map((v) => onNodes(nodes, v)) : [],
        positions: settings.positions,
        crossings: crossings ? crossings.positions.map((p) => p.position) : null,
        boundaryAt: meanProfileCrossing,
        hermiteNodes: settings.information.hermiteNodes,
        kernelDensity: settings.information.kernelDensity,
        slowResamples: settings.bootstrap.slowResamples,
      },
      settings.bootstrap.resamples,
      random,
      progress,
      [STAGES.bootstrapStart, STAGES.bootstrapEnd],
    );
  }
  const use: ReplicateUse[] = [];
  const estimateOf = (value: number, reps: ArrayLike<number> | null | undefined) => bootstrapEstimate(value, reps ?? null, use);

  const sigmaX = curve.sigmaX;
  // The band is drawn point by point; a resample that masks a point near the mask's threshold is
  // simply left out there (not counted in the dropped-resample warning, which is about summaries).
  const sigmaXCi95 = Array.from(sigmaX, (v, k) => (Number.isFinite(v) && replicates ? bootstrapEstimate(v, replicates.sigmaX[k])?.ci95 ?? null : null));

  const last = nodes.x.length - 1;
  const regionMean = onNodes(nodes, moments.mean);
  const regionSd = onNodes(nodes, moments.sd);
  const sigmaXSummary = summariseSigma(
    scaled(centredEstimate(effectiveSigma(nodes.x, inRegion.sigma), replicates?.effectiveSigma ?? null, n, "log", use)),
    region,
    inRegion,
    settings.coords,
  );
  const smallNoise = centredEstimate(smallNoiseInformation(nodes.x, inRegion.sigma, 0, last), replicates?.smallNoise ?? null, n, "linear", use);
  const direct = estimateOf(gaussianInformation(nodes.x, regionMean, regionSd, 0, last, settings.information.hermiteNodes), replicates?.direct);
  const kernelDensity = settings.information.kernelDensity
    ? estimateOf(kernelInformation(nodes.x, values.map((v) => onNodes(nodes, v)), 0, last), replicates?.kernelDensity)
    : null;
  let directExtrapolated: SampleSizeExtrapolation | null = null;
  if (settings.information.extrapolate) {
    progress(STAGES.extrapolate, "information extrapolation");
    directExtrapolated = sampleSizeExtrapolation(
      n,
      (idx) => {
        const m = ensembleMoments(values, idx);
        return gaussianInformation(nodes.x, onNodes(nodes, m.mean), onNodes(nodes, m.sd), 0, last, settings.information.hermiteNodes);
      },
      settings.information.extrapolationRepeats,
      random,
    );
    if (directExtrapolated.extrapolated === null)
      warnings.add(
        "direct-not-extrapolated",
        `The direct information estimate cannot be corrected for its small-sample bias with ${n} embryos (the extrapolation needs at least 12); the raw direct value reads high`,
        "Read the small-noise value, or image more embryos.",
      );
  }

  const sigmaXAtPositions = settings.positions.map((position, p) => ({
    position,
    sigmaX: scaled(estimateOf(sigmaAt(grid.x, sigmaX, position), replicates?.atPositions[p])),
  }));

  let boundary: BoundaryResult | null = null;
  if (boundarySetup && crossings) {
    const sd = scaled(crossings.sd);
    const sigmaAtThreshold = meanProfileCrossing === null ? null : scaled(estimateOf(sigmaAt(grid.x, sigmaX, meanProfileCrossing), replicates?.sigmaAtBoundary));
    boundary = {
      ...boundarySetup,
      positions: crossings.positions,
      neverCross: crossings.neverCross,
      meanPosition: crossings.meanPosition,
      sd,
      sdBootstrapCi95: sd && replicates ? bootstrapEstimate(sd.value, replicates.boundarySd)?.ci95 ?? null : null,
      meanProfileCrossing,
      sigmaXAtThreshold: sigmaAtThreshold,
      ratio: sd && sigmaAtThreshold && sigmaAtThreshold.value > 0 ? sd.value / sigmaAtThreshold.value : null,
    };
    if (crossings.neverCross.length > 0)
      warnings.add(
        "no-crossing",
        `${crossings.neverCross.length} embryo(s) never cross the threshold ${boundarySetup.threshold.toPrecision(4)}: ${crossings.neverCross.join(", ")}`,
        "Choose a threshold inside every embryo's range (boundary.threshold or boundary.atPosition).",
      );
  }

  let decoding: DecodingMap | null = null;
  if (settings.decoding.enabled) {
    progress(STAGES.decoding, "decoding");
    const needed = settings.decoding.leaveOneOut ? 4 : 3;
    if (n >= needed) decoding = decodingMap(grid.x, [values], region.startIndex, region.endIndex, settings.decoding.leaveOneOut, settings.decoding.poolPoints ?? slope.windowPoints);
    else warnings.add("decoding-skipped", `Decoding needs at least ${needed} embryos, got ${n}`, "Add embryos or turn off leave-one-out decoding.");
  }

  progress(STAGES.scaling, "scaling");
  const scaling = meanLengthUm === null ? null : scalingStep(settings, prepared, crossings, warnings);
  const outliers = outlierStep(settings, prepared, crossings, warnings);

  const biased = (
    [
      ["raw direct information", direct],
      ["kernel-density information", kernelDensity],
    ] as const
  ).filter(([, b]) => b !== null && b.bias !== null && b.se !== null && Math.abs(b.bias) > b.se);
  if (biased.length > 0)
    warnings.add(
      "bootstrap-bias",
      `The bootstrap replicates of the ${biased.map(([name]) => name).join(" and ")} lie above the estimate by more than their spread: ` +
        "a direct estimate from a finite number of embryos is biased upward, so its percentile interval can miss its own value",
      "Read the direct value extrapolated to infinitely many embryos, which is the headline direct estimate.",
    );
  const dropped = use.filter((u) => u.dropped > 0.05 * (u.used + u.dropped));
  if (dropped.length > 0)
    warnings.add(
      "bootstrap-dropped",
      `${dropped.length} bootstrap summaries lost more than 5% of their resamples to undefined values (e.g. a resample with no crossing or a masked neighbour)`,
      "Treat those intervals with care; more embryos make resamples better behaved.",
    );

  const counts: Record<MaskReason, number> = { "no-variance": 0, "shallow-slope": 0, imprecise: 0 };
  for (const r of curve.mask) if (r) counts[r] += 1;
  progress(1, "done");
  return {
    nEmbryos: n,
    embryos,
    coords: settings.coords,
    unit: settings.coords === "absolute" ? "um" : "fraction of length",
    meanLengthUm,
    gridX: Array.from(grid.x),
    meanIntensity: Array.from(moments.mean),
    sdIntensity: Array.from(moments.sd),
    slope: Array.from(slope.slope),
    sigmaX: Array.from(sigmaX, (v) => (Number.isFinite(v) ? v : null)),
    sigmaXCi95,
    sigmaXExpectedRelativeError: 1 / Math.sqrt(2 * (n - 1)),
    mask: {
      reason: curve.mask,
      maskedPositions: Array.from(grid.x).filter((_, k) => masked[k]),
      counts,
      rule: { ...settings.mask },
    },
    sigmaXSummary,
    sigmaXAtPositions,
    boundary,
    positionalInformation: {
      region,
      smallNoise,
      direct,
      directExtrapolated,
      kernelDensity,
      note:
        `Uniform prior over the region ${region.from}–${region.to} (${region.description}); positions inside it whose slope is not resolved count as carrying no information. ` +
        "The small-noise approximation reads slightly low on a bounded region (by a few σ_x/L bits); the direct estimate from a finite number of embryos is biased upward, " +
        "so the direct headline is the value extrapolated to infinitely many embryos (Tkačik, Dubuis, Petkova, Gregor 2015, Genetics).",
    },
    decoding,
    scaling,
    outliers,
    normalisation: {
      method: prepared.normalisation.method,
      applied: prepared.normalisation.applied,
      reason: prepared.normalisation.reason,
      iterations: prepared.normalisation.iterations,
      converged: prepared.normalisation.converged,
      perEmbryo: prepared.normalisation.perEmbryo,
      varianceSteps: prepared.varianceSteps,
    },
    orientation: prepared.orientation,
    settings: {
      coords: settings.coords,
      grid: { spacing: grid.spacing, spacingSource: grid.spacingSource, range: grid.range, rangeSource: grid.rangeSource, points: grid.x.length },
      normalisation: settings.normalisation,
      flip: settings.flip,
      derivative: {
        method: slope.method,
        windowPoints: slope.windowPoints,
        polynomialOrder: slope.polynomialOrder,
        description:
          slope.method === "model"
            ? `slope of the caller's model curve, ${settings.derivative.refit ? "refitted in every bootstrap resample" : "held fixed in bootstrap resamples"}`
            : `Savitzky–Golay derivative of the mean profile, ${slope.windowPoints}-point window, order ${slope.polynomialOrder}`,
        modelDeviationRms,
        refitInResamples: slope.method === "model" ? settings.derivative.refit !== undefined : null,
      },
      mask: { ...settings.mask },
      region: settings.region,
      regionDefault: { ...settings.regionDefault },
      bootstrap: { ...settings.bootstrap },
      information: { ...settings.information },
      decoding: { ...settings.decoding },
      outlierThreshold: settings.outlierThreshold,
    },
    warnings: warnings.list(),
  };
}

const fmt = (v: number) => String(Number(v.toPrecision(6)));

function summariseSigma(
  e: ScaledEstimate | null,
  region: AnalysisRegion,
  inRegion: ReturnType<typeof regionSigma>,
  coords: PrecisionSettings["coords"],
): SigmaXSummary | null {
  if (!e) return null;
  const unit = coords === "absolute" ? "µm" : "of length";
  return {
    ...e,
    method: "geometric mean over the region",
    description:
      `Geometric mean of σ_x over ${fmt(region.from)}–${fmt(region.to)} ${unit} (the constant σ_x carrying the same small-noise positional information), ` +
      "with the small-sample bias of ln σ_x removed; positions whose slope is not resolved count as σ_x = L/√(2πe) (no information). " +
      "Interval: bootstrap over embryos, t interval on the log scale centred on the value.",
    cappedPositions: inRegion.capped,
    filledPositions: inRegion.filled,
    regionPositions: region.endIndex - region.startIndex + 1,
  };
}

/** Say how much of the region could not be used as measured. */
function noteRegion(warnings: WarningList, region: AnalysisRegion, inRegion: ReturnType<typeof regionSigma>): void {
  const total = region.endIndex - region.startIndex + 1;
  if (inRegion.capped > 0)
    warnings.add(
      "region-unresolved",
      `${inRegion.capped} of ${total} grid positions in the region ${fmt(region.from)}–${fmt(region.to)} have a slope the data cannot resolve or σ_x above L/√(2πe); ` +
        "they count as carrying no positional information, which lowers the information and raises the headline σ_x",
      "If those positions lie outside the patterned part of the axis, state a narrower region (region FROM:TO); more embryos resolve shallower slopes.",
    );
  if (inRegion.filled > 0)
    warnings.add(
      "region-no-variance",
      `${inRegion.filled} grid positions in the region have no spread across embryos (e.g. pinned by normalisation); their σ_x was interpolated from their neighbours`,
      'Use normalisation "none" or "scale-offset", or a region that avoids the pinned points.',
    );
}

/** RMS over the grid of (model − mean)/(SE of the mean): how far the model misses the data. */
function modelDeviation(model: Float64Array, mean: Float64Array, sd: Float64Array, n: number): number | null {
  let s = 0;
  let count = 0;
  for (let k = 0; k < mean.length; k++) {
    if (!(sd[k] > 0)) continue;
    s += ((model[k] - mean[k]) / (sd[k] / Math.sqrt(n))) ** 2;
    count += 1;
  }
  return count > 0 ? Math.sqrt(s / count) : null;
}

function noteSettings(
  warnings: WarningList,
  settings: PrecisionSettings,
  prepared: PreparedEnsemble,
  mask: (MaskReason | null)[],
  modelDeviationRms: number | null,
  n: number,
): void {
  const relativeError = 1 / Math.sqrt(2 * (n - 1));
  if (relativeError > 0.25)
    warnings.add(
      "few-embryos",
      `With ${n} embryos σ_x is uncertain by about ±${Math.round(100 * relativeError)}% (1/√(2(n−1)))`,
      "Image more embryos; about 30 give ±13%.",
    );
  if (settings.normalisation !== "none")
    warnings.add(
      "normalisation-may-understate",
      `Per-embryo "${settings.normalisation}" normalisation removes real amplitude variation and can understate σ_x`,
      'Compare with normalisation "none" before drawing conclusions about precision.',
    );
  const maskedCount = mask.filter((r) => r !== null).length;
  if (maskedCount > 0)
    warnings.add(
      "masked-positions",
      `σ_x is not reported at ${maskedCount} of ${mask.length} grid positions (flat gradient, no spread or σ_x too large)`,
      "See mask.reason; the masking rule (minimal slope signal-to-noise, largest σ_x as a fraction of the span) can be changed in the mask settings.",
    );
  if (modelDeviationRms !== null && modelDeviationRms > 3)
    warnings.add(
      "model-mismatch",
      `The model curve differs from the group mean by ${modelDeviationRms.toFixed(1)} standard errors (RMS over the grid); its slope may not describe these data`,
      'Check the fit (same normalisation and coordinates as this analysis) or use the "savitzky-golay" slope.',
    );
  const known = new Set(prepared.embryos);
  const unknown = Object.keys(settings.embryoSummaries).filter((e) => !known.has(e));
  if (unknown.length > 0)
    warnings.add("unknown-summaries", `Summaries given for embryos not in the group: ${unknown.join(", ")}`, "Check the embryo labels.");
}

function chooseThreshold(
  settings: PrecisionSettings,
  gridX: Float64Array,
  mean: Float64Array,
  region: AnalysisRegion,
  warnings: WarningList,
): Pick<BoundaryResult, "threshold" | "thresholdSource" | "levelPosition"> | null {
  if (settings.boundary.threshold !== null)
    return { threshold: settings.boundary.threshold, thresholdSource: "given", levelPosition: null };
  const g = gridX.length;
  const position = settings.boundary.atPosition ?? 0.5 * (region.from + region.to);
  if (position < gridX[0] || position > gridX[g - 1]) {
    warnings.add(
      "boundary-position-outside",
      `boundary.atPosition ${position} lies outside the grid [${gridX[0]}, ${gridX[g - 1]}]; no boundary analysis`,
      "Give a position inside the grid (same units as the grid), or a threshold.",
    );
    return null;
  }
  const threshold = interpolateLinear(gridX, mean, [position])[0];
  return { threshold, thresholdSource: "mean level at position", levelPosition: position };
}

function scalingStep(
  settings: PrecisionSettings,
  prepared: PreparedEnsemble,
  crossings: ReturnType<typeof boundaryCrossings> | null,
  warnings: WarningList,
): ScalingComparison | null {
  const lengthsUm = prepared.lengthsUm as number[];
  const quantitiesUm: Record<string, (number | null)[]> = {};
  if (crossings)
    quantitiesUm.boundaryPositionUm = crossings.positions.map((p, i) =>
      p.position === null ? null : settings.coords === "relative" ? p.position * lengthsUm[i] : p.position,
    );
  for (const metric of settings.scalingMetrics) {
    const column = prepared.embryos.map((e) => settings.embryoSummaries[e]?.[metric] ?? null);
    if (column.some((v) => v !== null)) quantitiesUm[metric] = column;
  }
  try {
    return scalingComparison({
      profiles: prepared.profiles,
      normalisation: settings.normalisation,
      polynomialOrder: settings.derivative.polynomialOrder,
      mask: settings.mask,
      lengthsUm,
      quantitiesUm,
    });
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    warnings.add("scaling-skipped", `Absolute vs relative comparison not possible: ${error.message}`, "Check the embryo lengths and the grid.");
    return null;
  }
}

function outlierStep(
  settings: PrecisionSettings,
  prepared: PreparedEnsemble,
  crossings: ReturnType<typeof boundaryCrossings> | null,
  warnings: WarningList,
): OutlierReport {
  const metrics: Record<string, (number | null)[]> = {};
  const norm = prepared.normalisation;
  if (norm.applied && norm.method !== "none") {
    metrics.normalisationScale = norm.perEmbryo.map((e) => e.scale);
    metrics.normalisationOffset = norm.perEmbryo.map((e) => e.offset);
  }
  metrics.residualRms = norm.perEmbryo.map((e) => e.residualRms);
  if (crossings) metrics.boundaryPosition = crossings.positions.map((p) => p.position);
  const names = new Set<string>();
  for (const summary of Object.values(settings.embryoSummaries)) for (const key of Object.keys(summary)) names.add(key);
  for (const name of names) metrics[name] = prepared.embryos.map((e) => settings.embryoSummaries[e]?.[name] ?? null);
  const report = flagOutliers(prepared.embryos, metrics, settings.outlierThreshold, {
    logScale: ["normalisationScale", "residualRms"],
    upperOnly: ["residualRms"],
  });
  if (report.flagged.length > 0)
    warnings.add(
      "outliers",
      `Flagged (kept in the analysis): ${report.flagged.map((f) => `${f.embryo} (${f.metric}, z = ${f.z.toFixed(1)})`).join("; ")}`,
      "Inspect these embryos; exclude them from the group if they are imaging failures.",
    );
  return report;
}
