import type { DynamicsQuantities } from "../../api/types/dynamics.ts";
import { keyNumbers } from "../../components/keyNumbers.ts";
import { formatEstimate } from "../../format/formatEstimate.ts";

const ROWS: [keyof DynamicsQuantities, string, string][] = [
  ["D_um2_per_s", "D", "µm²/s"],
  ["k_per_s", "k", "1/s"],
  ["lambda_um", "λ", "µm"],
  ["half_life_s", "half-life", "s"],
  ["mobile_fraction", "mobile fraction", ""],
  ["half_time_s", "FRAP half-time", "s"],
];

/** Tiles for the shared dynamics quantities present in an answer, each with its 95% interval. */
export function quantityTiles(q: DynamicsQuantities, extra: { label: string; value: string; key?: string }[] = []): HTMLElement {
  const items = ROWS.filter(([key]) => q[key] !== null && q[key] !== undefined).map(([key, label, unit]) => ({ label, value: formatEstimate(q[key] as never, unit, { ci: true }), key }));
  return keyNumbers([...items, ...extra]);
}
