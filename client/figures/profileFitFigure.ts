import { chartPoints } from "./chartPoints.ts";
import { lineDataset, pointDataset } from "./datasetStyles.ts";
import type { FitFigureInput } from "./figureInputs.ts";
import { formatWithError } from "./figureNumbers.ts";
import { SERIES_COLOURS, withAlpha } from "./palette.ts";
import { scatterConfig, type FigureConfig } from "./scatterConfig.ts";

export type IntensityScale = "linear" | "log";

/** "wt-03 (wt, glm)": who the profile belongs to. */
export function profileLabel(fit: FitFigureInput): string {
  const p = fit.profile;
  return p ? `${p.embryo} (${p.genotype}, ${p.channel})` : `fit ${fit.id}`;
}

/**
 * A stored fit over the profile it was fitted to: measured intensities as
 * points (those outside the fit window paler), the fitted curve, and λ ± SE
 * in the legend. On the log scale an exponential decay is a straight line;
 * non-positive intensities cannot be shown there and are counted in the legend.
 */
export function profileFitFigure(fit: FitFigureInput, scale: IntensityScale = "linear"): FigureConfig {
  const f = fit.result.fit;
  const p = fit.profile;
  const positions = p ? Array.from(p.positionsUm) : [];
  const intensities = p ? Array.from(p.intensities) : [];
  const xUm = f.xUm ?? [];
  const lo = xUm.length ? xUm[0] : -Infinity;
  const hi = xUm.length ? xUm[xUm.length - 1] : Infinity;
  const log = scale === "log";
  const shown = (v: number) => !log || v > 0;
  const inside: [number[], number[]] = [[], []];
  const outside: [number[], number[]] = [[], []];
  let hidden = 0;
  positions.forEach((x, i) => {
    const y = intensities[i];
    if (!shown(y)) {
      hidden++;
      return;
    }
    const target = f.ok && (x < lo || x > hi) ? outside : inside;
    target[0].push(x);
    target[1].push(y);
  });
  const datasets = [pointDataset(`measured intensity${hidden ? ` (${hidden} point(s) ≤ 0 not shown on the log scale)` : ""}`, chartPoints(...inside), SERIES_COLOURS[7])];
  if (outside[0].length) datasets.push(pointDataset("outside the fit window", chartPoints(...outside), withAlpha(SERIES_COLOURS[7], 0.35)));
  let title = `${profileLabel(fit)}: ${f.model} fit`;
  if (f.ok && f.fitted) {
    const lambda = f.parameters?.lambdaUm;
    const x0 = f.parameters?.x0Um;
    const what = lambda ? `λ = ${formatWithError(lambda.value, lambda.se, "µm")}` : x0 ? `x₀ = ${formatWithError(x0.value, x0.se, "µm")}` : "";
    const r2 = f.r2 !== null && f.r2 !== undefined ? `, R² = ${f.r2.toFixed(3)}` : "";
    const fitted = xUm.map((x, i) => [x, f.fitted![i]] as const).filter(([, y]) => shown(y));
    datasets.push(lineDataset(`${f.model} fit${what ? `, ${what}` : ""}${r2}`, chartPoints(fitted.map((v) => v[0]), fitted.map((v) => v[1])), SERIES_COLOURS[0]));
  } else {
    title += ` — ${f.status}`;
    datasets[0].label = `measured intensity (no fitted curve: ${f.message})`;
  }
  return scatterConfig({
    title: f.ok && f.status !== "converged" ? `${title} (${f.status})` : title,
    datasets,
    x: { title: "position from source (µm)", min: positions.reduce((m, x) => Math.min(m, x), 0) },
    y: { title: log ? "intensity (a.u., log scale)" : "intensity (a.u.)", type: log ? "logarithmic" : "linear" },
  });
}
