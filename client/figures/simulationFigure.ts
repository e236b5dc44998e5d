import { chartPoints } from "./chartPoints.ts";
import { lineDataset, type FigureDataset } from "./datasetStyles.ts";
import { rampColour, timeLabel } from "./buildUpFigure.ts";
import type { SimulationFigureInput } from "./dynamicsInputs.ts";
import { formatNumber } from "./figureNumbers.ts";
import { INK } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/** A what-if build-up: profiles at the reported times (early → late) and the steady state (dashed). */
export function simulationFigure(s: SimulationFigureInput): FigureConfig {
  const datasets: FigureDataset[] = s.profiles.map((p, i) => lineDataset(timeLabel(p.t_s), chartPoints(s.positions_um, p.values), rampColour(i, s.profiles.length), { width: 1.8 }));
  datasets.push(lineDataset("steady state", chartPoints(s.positions_um, s.steady_state), INK, { dash: [6, 3] }));
  return scatterConfig({
    title: `Build-up for D = ${formatNumber(s.D_um2_per_s?.value ?? NaN)} µm²/s, k = ${formatNumber(s.k_per_s?.value ?? NaN)} 1/s (λ = ${formatNumber(s.lambda_um?.value ?? NaN)} µm)`,
    datasets,
    x: { title: "position from source (µm)" },
    y: { title: "concentration (a.u.)" },
  });
}
