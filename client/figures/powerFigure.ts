import { chartPoints } from "./chartPoints.ts";
import { lineDataset, pointDataset, type FigureDataset } from "./datasetStyles.ts";
import type { PlanFigureInput } from "./figureInputs.ts";
import { formatNumber } from "./figureNumbers.ts";
import { INK, SERIES_COLOURS } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

/**
 * Power against embryos per group: the exact power of the analytic test
 * (pooled t from the noncentral t for means, the F-test for spread), the
 * simulated power of Welch's t (or the F-test) and of the permutation test,
 * with the target power as a line.
 */
export function powerFigure(plan: PlanFigureInput): FigureConfig {
  const rows = [...plan.table].sort((a, b) => a.n - b.n);
  const n = rows.map((r) => r.n);
  const mean = plan.quantity !== "spread";
  const withLine = (d: FigureDataset, radius: number): FigureDataset => ({ ...d, pointStyle: "circle", pointRadius: radius, pointHoverRadius: radius + 1 });
  const datasets = [
    withLine(lineDataset(mean ? "exact (noncentral t, pooled)" : "exact (F-test)", chartPoints(n, rows.map((r) => r.power_analytic)), SERIES_COLOURS[0]), 3),
    withLine(lineDataset(mean ? "simulated, Welch's t" : "simulated, F-test", chartPoints(n, rows.map((r) => r.power_simulated)), SERIES_COLOURS[1], { dash: [5, 3] }), 3),
  ];
  const perm = rows.filter((r) => r.power_permutation_simulated !== null);
  if (perm.length) datasets.push(withLine(lineDataset("simulated, permutation test", chartPoints(perm.map((r) => r.n), perm.map((r) => r.power_permutation_simulated)), SERIES_COLOURS[3], { dash: [2, 2] }), 3));
  const ends = n.length ? [n[0], n[n.length - 1]] : [2, 3];
  datasets.push(lineDataset(`target power ${formatNumber(plan.settings.power, 2)}`, chartPoints(ends, [plan.settings.power, plan.settings.power]), INK, { width: 1, dash: [4, 3] }));
  const required = rows.find((r) => r.n === plan.n_required);
  if (required) datasets.push(pointDataset(`required: ${plan.n_required} embryos per group`, chartPoints([required.n], [required.power_analytic]), INK, 6));
  const effect = `${plan.settings.effect > 0 ? "+" : ""}${formatNumber(plan.settings.effect * 100)}%`;
  return scatterConfig({
    title: `Power to detect a ${effect} change in ${plan.metric === "sigma_x" ? "spread" : "mean λ"}${plan.group ? ` (variability of ${plan.group})` : ""}, α = ${plan.settings.alpha}`,
    datasets,
    x: { title: "embryos per group (n)" },
    y: { title: "power (probability, 0–1)", min: 0, max: 1 },
  });
}
