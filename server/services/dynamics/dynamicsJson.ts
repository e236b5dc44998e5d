import type { Estimate } from "../../analysis/estimate.ts";

/** {value, se, ci95} as printed by --json and answered by the API. */
export interface EstimateJson {
  value: number;
  se: number | null;
  ci95: [number, number] | null;
}

export interface AccumulationJson extends EstimateJson {
  x_um: number;
}

/**
 * The quantities every dynamics result reports under the same names (null when
 * the analysis cannot give them): D, k, mobile fraction, FRAP half-time, λ,
 * half-life ln2/k and the local accumulation time τ(x).
 */
export interface DynamicsQuantities {
  D_um2_per_s: EstimateJson | null;
  k_per_s: EstimateJson | null;
  mobile_fraction: EstimateJson | null;
  half_time_s: EstimateJson | null;
  lambda_um: EstimateJson | null;
  half_life_s: EstimateJson | null;
  accumulation_time_s: AccumulationJson[];
}

export const est = (e: Estimate | null | undefined): EstimateJson | null => (e ? { value: e.value, se: e.se, ci95: e.ci95 } : null);

export function emptyQuantities(): DynamicsQuantities {
  return { D_um2_per_s: null, k_per_s: null, mobile_fraction: null, half_time_s: null, lambda_um: null, half_life_s: null, accumulation_time_s: [] };
}

/** Caution attached to every FRAP-derived D. Source: Sigaut et al. 2014, PLoS Comput Biol. */
export const frapCaveat =
  "The D measured by FRAP is the mobility of the labelled molecules over the bleached region and recovery time; it need not be the effective D that shapes the gradient (binding, transcytosis and tissue geometry can make them differ).";
