import { prepareEnsemble } from "../ensemble/prepareEnsemble.ts";
import type { NormalisationMethod } from "../ensemble/normaliseEnsemble.ts";
import type { Coordinates, Profile } from "../ensemble/profile.ts";
import { ensembleMoments } from "./ensembleMoments.ts";
import { lengthScaling, type LengthScaling } from "./lengthScaling.ts";
import { meanSlope } from "./meanSlope.ts";
import { positionalErrorCurve, type MaskRule } from "./positionalError.ts";
import { minimumSigma } from "./sigmaSummaries.ts";

/** σ_x on one kind of grid, as computed for the side-by-side comparison. */
export interface SigmaCurve {
  coords: Coordinates;
  /** Grid positions: µm (absolute) or fraction of length (relative). */
  gridX: number[];
  /** σ_x in the grid's units, null where masked. */
  sigmaX: (number | null)[];
  /** Smallest σ_x in the grid's units and where it occurs; null if every position is masked. */
  minimum: { value: number; position: number } | null;
}

/** Does precision scale with embryo size? */
export interface ScalingComparison {
  meanLengthUm: number;
  /** σ_x on an absolute (µm) grid and on a relative (x/L) grid, same normalisation and masking rule. */
  absolute: SigmaCurve;
  relative: SigmaCurve;
  /**
   * Smallest σ_x of each, both in µm (relative × mean length). Relative coordinates
   * giving the smaller value means part of the spread in absolute position is explained by embryo size.
   */
  minimumUm: { absolute: number | null; relative: number | null };
  /** Log–log regressions on embryo length: boundary position and caller-supplied summaries (e.g. lambdaUm). */
  regressions: LengthScaling[];
}

export interface ScalingRequest {
  profiles: readonly Profile[];
  normalisation: NormalisationMethod;
  polynomialOrder: number;
  mask: MaskRule;
  /** Per-embryo lengths in µm, in the order of `profiles`, all known. */
  lengthsUm: readonly number[];
  /** Per-embryo quantities in µm to regress on length, by name. */
  quantitiesUm: Readonly<Record<string, readonly (number | null)[]>>;
}

/**
 * σ_x in absolute and relative coordinates side by side, and log–log
 * regressions of lengths on embryo length (exponent 1 = perfect scaling).
 * Both curves use the Savitzky–Golay slope with the default window for their grid.
 */
export function scalingComparison(request: ScalingRequest): ScalingComparison {
  const curve = (coords: Coordinates): SigmaCurve => {
    const prepared = prepareEnsemble(request.profiles, { grid: { coords, spacing: null, range: null }, normalisation: request.normalisation, flip: "none" });
    const moments = ensembleMoments(prepared.values);
    const slope = meanSlope(prepared.grid.x, prepared.grid.spacing, prepared.values, {
      method: "savitzky-golay",
      windowPoints: null,
      polynomialOrder: request.polynomialOrder,
    });
    const pe = positionalErrorCurve(prepared.grid.x, moments.sd, slope.slope, slope.slopeSe, request.mask);
    const min = minimumSigma(pe.sigmaX, 0, pe.sigmaX.length - 1);
    return {
      coords,
      gridX: Array.from(prepared.grid.x),
      sigmaX: Array.from(pe.sigmaX, (v) => (Number.isFinite(v) ? v : null)),
      minimum: min.index >= 0 ? { value: min.value, position: prepared.grid.x[min.index] } : null,
    };
  };
  const meanLengthUm = request.lengthsUm.reduce((a, b) => a + b, 0) / request.lengthsUm.length;
  const absolute = curve("absolute");
  const relative = curve("relative");
  const regressions: LengthScaling[] = [];
  for (const [name, values] of Object.entries(request.quantitiesUm)) {
    const fit = lengthScaling(name, request.lengthsUm, values);
    if (fit) regressions.push(fit);
  }
  return {
    meanLengthUm,
    absolute,
    relative,
    minimumUm: {
      absolute: absolute.minimum?.value ?? null,
      relative: relative.minimum ? relative.minimum.value * meanLengthUm : null,
    },
    regressions,
  };
}
