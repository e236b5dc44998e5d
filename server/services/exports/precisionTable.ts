import type { PrecisionFigureInput } from "../../../client/figures/figureInputs.ts";
import type { CsvTable } from "./csvText.ts";

/** σ_x(x) with its bootstrap 95% CI and the mean ± SD profile on the analysis grid (µm, or fractions of length in relative coordinates). */
export function precisionTable(p: PrecisionFigureInput): CsvTable {
  const u = p.unit === "um" ? "um" : "fraction_of_length";
  return {
    columns: [`position_${u}`, "mean_intensity_au", "sd_intensity_au", `sigma_x_${u}`, `sigma_x_ci95_low_${u}`, `sigma_x_ci95_high_${u}`],
    rows: p.x.map((x, i) => [x, p.mean_intensity[i], p.sd_intensity[i], p.sigma_x[i], p.sigma_x_ci95[i]?.[0], p.sigma_x_ci95[i]?.[1]]),
  };
}
