import { acrossEmbryoVariance, varianceStep, type VarianceStep } from "./acrossEmbryoVariance.ts";
import type { AnalysisWarning } from "./analysisWarning.ts";
import { chooseGrid, type CommonGrid, type GridRequest } from "./chooseGrid.ts";
import { detectOrientation, type OrientationCheck } from "./detectOrientation.ts";
import { flipProfile } from "./flipProfile.ts";
import { normaliseEnsemble, type NormalisationMethod, type NormalisationResult } from "./normaliseEnsemble.ts";
import { checkProfiles, type Profile } from "./profile.ts";
import { resampleEnsemble } from "./resampleEnsemble.ts";

export interface PrepareSettings {
  grid: GridRequest;
  normalisation: NormalisationMethod;
  /** "auto" flips the embryos flagged as reversed; "none" only flags them. */
  flip: "none" | "auto";
}

export interface PrepareOverrides {
  /** Flip exactly these embryos instead of deciding from this group (used to keep channels of one embryo together). */
  forcedFlips?: ReadonlySet<string>;
  /** Resample onto this grid instead of choosing one (used to share one grid across channels). */
  grid?: CommonGrid;
}

export interface OrientationReport extends OrientationCheck {
  flip: "none" | "auto";
  flipped: string[];
  /** Effect of flipping on the across-embryo variance; null when nothing was flipped. */
  variance: VarianceStep | null;
}

/** A group ready for precision analysis: common grid, orientation settled, normalised. */
export interface PreparedEnsemble {
  grid: CommonGrid;
  embryos: string[];
  lengthsUm: (number | null)[];
  /** Profiles on the grid after flipping, before normalisation. */
  resampled: Float64Array[];
  /** Profiles on the grid after normalisation: the input to every precision measure. */
  values: Float64Array[];
  orientation: OrientationReport;
  normalisation: NormalisationResult;
  /** What each preparation step did to the across-embryo variance, in order. */
  varianceSteps: VarianceStep[];
  /** Profiles as analysed (flipped where flipped). */
  profiles: Profile[];
  warnings: AnalysisWarning[];
}

/** Resample onto a common grid, settle orientation, normalise: the ensemble preparation pipeline. */
export function prepareEnsemble(profiles: readonly Profile[], settings: PrepareSettings, overrides: PrepareOverrides = {}): PreparedEnsemble {
  if (profiles.length < 2) throw new RangeError(`prepareEnsemble: needs at least 2 embryos, got ${profiles.length}`);
  checkProfiles(profiles, settings.grid.coords);
  const warnings: AnalysisWarning[] = [];
  // Orientation is judged on the range every profile covers as exported, whatever grid is finally used.
  const detectionGrid = chooseGrid(profiles, { ...settings.grid, range: null });
  const first = resampleEnsemble(profiles, detectionGrid);
  const check = detectOrientation(first.embryos, first.values, detectionGrid.x);
  const toFlip = overrides.forcedFlips
    ? new Set(overrides.forcedFlips)
    : new Set(settings.flip === "auto" ? check.flagged : []);
  const used = toFlip.size > 0 ? profiles.map((p) => (toFlip.has(p.embryo) ? flipProfile(p) : p)) : [...profiles];
  const grid = overrides.grid ?? (toFlip.size > 0 || settings.grid.range ? chooseGrid(used, settings.grid) : detectionGrid);
  const ensemble = grid === detectionGrid ? first : resampleEnsemble(used, grid);
  let orientationVariance: VarianceStep | null = null;
  if (toFlip.size > 0) {
    const flippedOnDetectionGrid = resampleEnsemble(used, chooseGrid(used, { ...settings.grid, range: null }));
    orientationVariance = varianceStep("orientation", acrossEmbryoVariance(first.values), acrossEmbryoVariance(flippedOnDetectionGrid.values));
    warnings.push({
      code: "embryos-flipped",
      message: `${toFlip.size} embryo(s) were read from the other end: ${[...toFlip].join(", ")}`,
      fix: 'Check the images; set flip to "none" to keep every profile as exported.',
    });
  }
  const unflippedFlags = check.flagged.filter((e) => !toFlip.has(e));
  if (unflippedFlags.length > 0)
    warnings.push({
      code: "orientation-flagged",
      message: `${unflippedFlags.length} embryo(s) run against the group (${check.groupTrend === "falls" ? "rise where it falls" : "fall where it rises"}) and were not flipped: ${unflippedFlags.join(", ")}`,
      fix: 'Set flip to "auto" to flip them, or exclude them if they are not reversed.',
    });
  const normalisation = normaliseEnsemble(ensemble.embryos, ensemble.values, settings.normalisation);
  if (!normalisation.applied || !normalisation.converged)
    warnings.push({
      code: "normalisation-not-applied",
      message: `Normalisation "${settings.normalisation}" ${normalisation.applied ? "did not converge" : "was not applied"}: ${normalisation.reason}`,
      fix: 'Flip or exclude the embryos named, or choose normalisation "none".',
    });
  const steps: VarianceStep[] = [];
  if (orientationVariance) steps.push(orientationVariance);
  steps.push(normalisation.variance);
  return {
    grid: ensemble.grid,
    embryos: ensemble.embryos,
    lengthsUm: ensemble.lengthsUm,
    resampled: ensemble.values,
    values: normalisation.values,
    orientation: { ...check, flip: settings.flip, flipped: [...toFlip], variance: orientationVariance },
    normalisation,
    varianceSteps: steps,
    profiles: used,
    warnings,
  };
}
