/**
 * The contract every steady-state gradient model fulfils, so that one fitter
 * (variable projection, fit/) can fit them all.
 *
 * A model is separable: profile(x) = amplitude · g(x; θ) + background, where
 * θ holds the nonlinear parameters (decay length, source width, …) and the
 * amplitude and background enter linearly. The model supplies the basis
 * function g, its analytic derivatives ∂g/∂θ, parameter bounds and a start
 * drawn from the data; the fitter adds the constant background column.
 */

/** Every model name the fitter accepts. */
export const modelNames = ["exponential", "finite", "source", "power", "power-free"] as const;
export type ModelName = (typeof modelNames)[number];

/** What the fitter knows about the positions a model is fitted to. */
export interface ProfileExtent {
  /** Smallest position in the fitted window (µm). */
  xMinUm: number;
  /** Largest position in the fitted window (µm). */
  xMaxUm: number;
  /** Smallest positive spacing between neighbouring positions (µm). */
  minSpacingUm: number;
  /** Embryo length L (µm), or null when none was supplied. */
  lengthUm: number | null;
}

/** A nonlinear parameter; all of them are positive and are optimised on a log scale. */
export interface NonlinearParameter {
  /** Key under which results report it, unit in the name: "lambdaUm". */
  name: string;
  /** Unit shown beside the value: "µm", "" for dimensionless. */
  unit: string;
  description: string;
}

/** A quantity computed from fitted parameters, with uncertainty by the delta method. */
export interface DerivedQuantity {
  name: string;
  unit: string;
  description: string;
  /** Positive by definition (e.g. λ²): its 95% interval is computed on the log scale. */
  positive?: boolean;
  /**
   * Value from the nonlinear parameters θ and the linear ones; writes the
   * gradient with respect to [θ…, amplitude, background] into `gradient`
   * (length θ.length + 2).
   */
  evaluate(theta: ArrayLike<number>, amplitude: number, background: number, gradient: Float64Array): number;
}

export interface ParameterBounds {
  lower: number[];
  upper: number[];
}

export interface SteadyStateModel {
  readonly name: ModelName;
  /** The profile in words and symbols, for reports. */
  readonly formula: string;
  /** Where the steady state comes from (paper or derivation). */
  readonly source: string;
  /** True when a profile cannot be fitted without the embryo length L. */
  readonly requiresLength: boolean;
  /** Nonlinear parameters, in the order θ is passed. */
  readonly parameters: readonly NonlinearParameter[];
  /** What the amplitude means physically. */
  readonly amplitudeDescription: string;
  /**
   * Writes g(x_i; θ) into `value` and, when `derivatives` is not null,
   * ∂g/∂θ_j into derivatives[j]. `lengthUm` is Infinity on a semi-infinite
   * domain. Must not allocate: it runs in the fitter's inner loop.
   */
  basis(
    x: Float64Array,
    theta: Float64Array,
    lengthUm: number,
    value: Float64Array,
    derivatives: Float64Array[] | null,
  ): void;
  /** Bounds for θ chosen from the data's extent (wide enough never to bind for a decaying profile). */
  bounds(extent: ProfileExtent): ParameterBounds;
  /** A start for θ drawn from the data (x ascending). Clamped to the bounds by the fitter. */
  initialGuess(x: Float64Array, y: Float64Array, extent: ProfileExtent): number[];
  /** A sentence describing why these positions cannot be fitted, or null when they can. */
  checkDomain(extent: ProfileExtent): string | null;
  /** Quantities implied by the fitted parameters (e.g. D/k = λ²). */
  readonly derived: readonly DerivedQuantity[];
}
