import type { PlanResponse } from "../groups/planResponse.ts";
import type { CsvTable } from "./csvText.ts";

/** The power table of a sample-size plan, the tests named in the columns (pooled and Welch's t for means, the F-test for spread). */
export function planTable(p: PlanResponse): CsvTable {
  const mean = p.quantity === "mean";
  return {
    columns: mean
      ? ["n_per_group", "power_exact_pooled_t", "power_normal_approximation", "power_simulated_welch_t", "power_simulated_permutation"]
      : ["n_per_group", "power_exact_f_test", "power_normal_approximation", "power_simulated_f_test", "power_simulated_permutation"],
    rows: p.table.map((r) => [r.n, r.power_analytic, r.power_normal, r.power_simulated, r.power_permutation_simulated]),
  };
}
