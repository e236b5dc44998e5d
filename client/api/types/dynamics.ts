import type { BuildUpFigureInput, FrapFigureInput, SimulationFigureInput } from "../../figures/dynamicsInputs.ts";
import type { EstimateLike } from "../../format/formatEstimate.ts";

type Est = (EstimateLike & { value: number }) | null;

/** The quantities every dynamics answer carries (null where an analysis cannot give them). */
export interface DynamicsQuantities {
  D_um2_per_s: Est;
  k_per_s: Est;
  mobile_fraction: Est;
  half_time_s: Est;
  lambda_um: Est;
  half_life_s: Est;
  accumulation_time_s: (EstimateLike & { value: number; x_um: number })[];
}

export interface TimeCourseGroup extends DynamicsQuantities, BuildUpFigureInput {
  D_um2_per_s: Est;
  k_per_s: Est;
  lambda_um: Est;
  accumulation_time_s: (EstimateLike & { value: number; x_um: number })[];
  message: string;
  n_profiles: number;
  n_embryos: number;
  times_s: number[];
  source_strength: (EstimateLike & { value: number; unit: string }) | null;
  correlation_D_k: number | null;
  identifiable: boolean | null;
  warnings: string[];
  caveat: string;
}

export interface FrapResult extends DynamicsQuantities, FrapFigureInput {
  D_um2_per_s: Est;
  n_curves: number;
  n_fitted: number;
  summary_method: string;
  curves: (FrapFigureInput["curves"][number] & { message: string; mobile_fraction: Est; half_time_s: Est; normalisation: string[]; warnings: string[] })[];
  caveat: string;
}

export interface CombineResult extends DynamicsQuantities {
  analysis_id: number;
  genotype: string;
  channel: string;
  model: string;
  n_embryos: number;
  source_flux: (EstimateLike & { value: number; unit: string }) | null;
  method: string[];
  caveat: string;
}

export interface SimulationResult extends DynamicsQuantities, SimulationFigureInput {
  D_um2_per_s: Est;
  k_per_s: Est;
  lambda_um: Est;
  analysis_id: number | null;
  fraction_of_steady_state: { x_um: number; fraction: number }[];
  note: string;
}
