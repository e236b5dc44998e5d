import type { BuildUpFitOptions } from "./buildUpFitOptions.ts";
import { influxBuildUp } from "./influxBuildUp.ts";
import { cellValueAt } from "../solver/cellValueAt.ts";
import { solveReactionDiffusion } from "../solver/solveReactionDiffusion.ts";
import { SolverSettings } from "../solver/solverSettings.ts";
import type { ReactionDiffusionProblem } from "../solver/reactionDiffusionProblem.ts";

/** Observations of a build-up: position (µm), time since production started (s), intensity. */
export interface BuildUpData {
  xUm: Float64Array;
  tS: Float64Array;
  values: Float64Array;
}

const solverSettings = SolverSettings.parse({ tolerance: 1e-4 });

/**
 * The build-up for a unit source (influx 1, or production rate 1 in the
 * source region) at every observation, for given D and k: the closed form on
 * the semi-infinite line with an influx, the solver otherwise (cell centres
 * interpolated linearly to the observed positions).
 */
export function buildUpResponse(data: BuildUpData, d: number, k: number, options: BuildUpFitOptions): Float64Array {
  const n = data.xUm.length;
  const out = new Float64Array(n);
  if (options.domain.kind === "semi-infinite" && options.source.kind === "influx") {
    for (let i = 0; i < n; i++) out[i] = influxBuildUp(data.xUm[i], data.tS[i], d, k, 1);
    return out;
  }
  const xMax = data.xUm.reduce((a, b) => Math.max(a, b), 0);
  const tMax = data.tS.reduce((a, b) => Math.max(a, b), 0);
  const lambda = Math.sqrt(d / k);
  const sourceWidth = options.source.kind === "region" ? options.source.widthUm : 0;
  const lengthUm = options.domain.kind === "finite" ? options.domain.lengthUm : Math.max(xMax, sourceWidth) + 10 * Math.min(lambda, 2 * Math.sqrt(d * tMax));
  const cells = Math.min(4000, Math.max(options.cells, Math.ceil((10 * lengthUm) / Math.min(lambda, lengthUm))));
  const problem: ReactionDiffusionProblem = {
    geometry: "line",
    lengthUm,
    cells,
    diffusionUm2PerS: d,
    degradationPerS: k,
    degradationOrder: 1,
    source: options.source.kind === "region" ? { fromUm: 0, toUm: Math.min(options.source.widthUm, lengthUm), ratePerS: 1 } : null,
    left: { kind: "flux", influx: options.source.kind === "influx" ? 1 : 0 },
    right: { kind: "flux", influx: 0 },
    initial: null,
  };
  const times = [...new Set(data.tS)].sort((a, b) => a - b);
  const run = solveReactionDiffusion(problem, times, solverSettings);
  const byTime = new Map(times.map((t, i) => [t, run.profiles[i]]));
  const h = lengthUm / cells;
  for (let i = 0; i < n; i++) {
    const c = byTime.get(data.tS[i])!;
    out[i] = cellValueAt(c, data.xUm[i], h);
  }
  return out;
}
