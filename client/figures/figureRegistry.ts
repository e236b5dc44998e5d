import { boundaryFigure } from "./boundaryFigure.ts";
import { decodingMapFigure } from "./decodingMapFigure.ts";
import { ensembleFigure } from "./ensembleFigure.ts";
import type { ComparisonFigureInput, FitFigureInput, PlanFigureInput, PrecisionFigureInput, TrackingFigureInput } from "./figureInputs.ts";
import { groupValuesFigure } from "./groupValuesFigure.ts";
import { powerFigure } from "./powerFigure.ts";
import { profileFitFigure, type IntensityScale } from "./profileFitFigure.ts";
import { residualFigure } from "./residualFigure.ts";
import type { FigureConfig } from "./scatterConfig.ts";
import { sigmaXFigure } from "./sigmaXFigure.ts";
import { trendFigure } from "./trendFigure.ts";
import { buildUpFigure, buildUpResidualFigure } from "./buildUpFigure.ts";
import { profileLikelihoodFigure } from "./profileLikelihoodFigure.ts";
import { dkRegionFigure } from "./dkRegionFigure.ts";
import { accumulationTimeFigure } from "./accumulationTimeFigure.ts";
import { frapRecoveryFigure, frapResidualFigure } from "./frapRecoveryFigure.ts";
import { simulationFigure } from "./simulationFigure.ts";
import type { BuildUpFigureInput, FrapFigureInput, SimulationFigureInput } from "./dynamicsInputs.ts";

/** Which API result a figure is drawn from. */
export type FigureSource = "fit" | "precision" | "comparison" | "tracking" | "plan" | "dynamics" | "frap" | "simulation";

/** The input type of each source. */
export interface FigureSourceInputs {
  fit: FitFigureInput;
  precision: PrecisionFigureInput;
  comparison: ComparisonFigureInput;
  tracking: TrackingFigureInput;
  plan: PlanFigureInput;
  dynamics: BuildUpFigureInput;
  frap: FrapFigureInput;
  simulation: SimulationFigureInput;
}

export interface FigureOptions {
  /** Intensity axis of the profile-fit figure; linear by default. */
  scale?: IntensityScale;
}

export interface FigureEntry<S extends FigureSource = FigureSource> {
  title: string;
  source: S;
  builder: (input: FigureSourceInputs[S], options?: FigureOptions) => FigureConfig;
}

/** An entry of any source (a union, so each builder keeps its own input type). */
export type AnyFigureEntry = { [S in FigureSource]: FigureEntry<S> }[FigureSource];

export const FIGURE_KINDS = ["profile-fit", "residuals", "group-values", "ensemble", "sigma-x", "boundary", "decoding-map", "trend", "power", "build-up", "build-up-residuals", "profile-likelihood-k", "dk-region", "accumulation-time", "frap-recovery", "frap-residuals", "simulation"] as const;
export type FigureKind = (typeof FIGURE_KINDS)[number];

const entry = <S extends FigureSource>(title: string, source: S, builder: FigureEntry<S>["builder"]): FigureEntry<S> => ({ title, source, builder });

/** Every figure: its title, the result it is drawn from and its builder. */
export const FIGURE_REGISTRY = {
  "profile-fit": entry("Profile with fitted curve", "fit", (fit, o) => profileFitFigure(fit, o?.scale ?? "linear")),
  residuals: entry("Residuals of a fit", "fit", (fit) => residualFigure(fit)),
  "group-values": entry("Per-embryo values by group", "comparison", (c) => groupValuesFigure(c)),
  ensemble: entry("Mean profile ± SD across embryos", "precision", (p) => ensembleFigure(p)),
  "sigma-x": entry("Positional error σ_x", "precision", (p) => sigmaXFigure(p)),
  boundary: entry("Boundary positions", "precision", (p) => boundaryFigure(p)),
  "decoding-map": entry("Decoding map", "precision", (p) => decodingMapFigure(p)),
  trend: entry("Trend over stage, age, dosage or length", "tracking", (t) => trendFigure(t)),
  power: entry("Power against sample size", "plan", (p) => powerFigure(p)),
  "build-up": entry("Build-up profiles with the joint fit", "dynamics", (b) => buildUpFigure(b)),
  "build-up-residuals": entry("Residuals of the build-up fit", "dynamics", (b) => buildUpResidualFigure(b)),
  "profile-likelihood-k": entry("Profile likelihood of k", "dynamics", (b) => profileLikelihoodFigure(b)),
  "dk-region": entry("D and k jointly: 95% region", "dynamics", (b) => dkRegionFigure(b)),
  "accumulation-time": entry("Local accumulation time τ(x)", "dynamics", (b) => accumulationTimeFigure(b)),
  "frap-recovery": entry("FRAP recovery curves with fits", "frap", (f) => frapRecoveryFigure(f)),
  "frap-residuals": entry("Residuals of the FRAP fits", "frap", (f) => frapResidualFigure(f)),
  simulation: entry("What-if build-up", "simulation", (s) => simulationFigure(s)),
} satisfies Record<FigureKind, AnyFigureEntry>;

/** Kinds drawn from one source, in registry order. */
export function figureKindsFor(source: FigureSource): FigureKind[] {
  return FIGURE_KINDS.filter((k) => FIGURE_REGISTRY[k].source === source);
}

/** Build the figure of `kind` from its source's JSON. */
export function buildFigure<K extends FigureKind>(kind: K, input: FigureSourceInputs[(typeof FIGURE_REGISTRY)[K]["source"]], options?: FigureOptions): FigureConfig {
  return (FIGURE_REGISTRY[kind].builder as (i: unknown, o?: FigureOptions) => FigureConfig)(input, options);
}
