import type { EstimateInput } from "./figureInputs.ts";

/** One build-up fit group as POST /api/dynamics/time-course answers it (fields the figures read). */
export interface BuildUpFigureInput {
  analysis_id: number;
  genotype: string;
  channel: string;
  status: string;
  D_um2_per_s: EstimateInput | null;
  k_per_s: EstimateInput | null;
  lambda_um: EstimateInput | null;
  accumulation_time_s: readonly (EstimateInput & { x_um: number })[];
  /** Correlation of the D and k estimates (null when the fit gives none). */
  correlation_D_k: number | null;
  /** Along the profile of k, D is re-fitted at each k. */
  profile_likelihood_k: readonly { k_per_s: number; deviance: number; D_um2_per_s?: number }[];
  profile_interval_k: readonly [number | null, number | null] | null;
  points: readonly { x_um: number; t_s: number; value: number; fitted: number }[];
}

/** A FRAP analysis as POST /api/dynamics/frap answers it. */
export interface FrapFigureInput {
  analysis_id: number;
  D_um2_per_s: EstimateInput | null;
  curves: readonly { name: string; status: string; D_um2_per_s: EstimateInput | null; points: readonly { t_s: number; value: number; fitted: number | null }[] }[];
}

/** A what-if run as POST /api/dynamics/simulate answers it. */
export interface SimulationFigureInput {
  D_um2_per_s: EstimateInput | null;
  k_per_s: EstimateInput | null;
  lambda_um: EstimateInput | null;
  positions_um: readonly number[];
  profiles: readonly { t_s: number; values: readonly number[] }[];
  steady_state: readonly number[];
}
