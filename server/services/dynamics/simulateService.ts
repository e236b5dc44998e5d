import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { accumulationTimes } from "../../analysis/dynamics/solver/accumulationTimes.ts";
import type { ReactionDiffusionProblem } from "../../analysis/dynamics/solver/reactionDiffusionProblem.ts";
import { solveReactionDiffusion } from "../../analysis/dynamics/solver/solveReactionDiffusion.ts";
import { SolverSettings } from "../../analysis/dynamics/solver/solverSettings.ts";
import { cellValueAt } from "../../analysis/dynamics/solver/cellValueAt.ts";
import { steadyState } from "../../analysis/dynamics/solver/steadyState.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import type { SimulateRequest } from "./dynamicsRequests.ts";
import { emptyQuantities, type DynamicsQuantities } from "./dynamicsJson.ts";

export interface SimulationJson extends DynamicsQuantities {
  analysis_id: number | null;
  positions_um: number[];
  profiles: { t_s: number; values: number[] }[];
  steady_state: number[];
  /** c(x, until)/c_s(x) at the reported positions of τ. */
  fraction_of_steady_state: { x_um: number; fraction: number }[];
  settings: SimulateRequest;
  note: string;
}

const solver = SolverSettings.parse({ tolerance: 1e-6 });

/** Run the model forward from c = 0 (finite volumes, no flux at the far end); store it when a database is given. */
export function simulateBuildUp(request: SimulateRequest, db: Db | null): SimulationJson {
  if (request.source && request.source.toUm > request.lengthUm)
    throw new UserError("bad-option", `the source region ends at ${request.source.toUm} µm, beyond the length ${request.lengthUm} µm`);
  const problem: ReactionDiffusionProblem = {
    geometry: "line",
    lengthUm: request.lengthUm,
    cells: request.cells,
    diffusionUm2PerS: request.diffusionUm2PerS,
    degradationPerS: request.degradationPerS,
    degradationOrder: 1,
    source: request.source ? { fromUm: request.source.fromUm, toUm: request.source.toUm, ratePerS: request.flux / (request.source.toUm - request.source.fromUm) } : null,
    left: { kind: "flux", influx: request.source ? 0 : request.flux },
    right: { kind: "flux", influx: 0 },
    initial: null,
  };
  const times = Array.from({ length: request.profiles }, (_, i) => (request.untilS * (i + 1)) / request.profiles);
  const run = solveReactionDiffusion(problem, times, solver);
  const cs = steadyState(problem);
  const tau = accumulationTimes(problem, solver);
  const h = request.lengthUm / request.cells;
  const positions = request.accumulationPositionsUm ?? Array.from({ length: 8 }, (_, i) => (i * request.lengthUm) / 8);
  const at = (arr: ArrayLike<number>, x: number) => cellValueAt(arr, x, h);
  const last = run.profiles[run.profiles.length - 1];
  const lambda = Math.sqrt(request.diffusionUm2PerS / request.degradationPerS);
  const exact = (v: number) => ({ value: v, se: null, ci95: null });
  const result = {
    ...emptyQuantities(),
    D_um2_per_s: exact(request.diffusionUm2PerS),
    k_per_s: exact(request.degradationPerS),
    lambda_um: exact(lambda),
    half_life_s: exact(Math.LN2 / request.degradationPerS),
    accumulation_time_s: positions.map((x) => ({ x_um: x, ...exact(at(tau.timesS, x)) })),
    positions_um: Array.from(run.positionsUm),
    profiles: run.profiles.map((c, i) => ({ t_s: times[i], values: Array.from(c) })),
    steady_state: Array.from(cs),
    fraction_of_steady_state: positions.map((x) => ({ x_um: x, fraction: at(last, x) / at(cs, x) })),
    settings: request,
    note: "A model run, not a measurement: the numbers carry no uncertainty. τ(x) is computed from the simulation (∫(1 − c/c_s) dt) on this finite domain with a closed far end.",
  };
  const id = db
    ? storeAnalysis(db, { kind: "simulation", selection: {}, settings: request, engineVersion: ENGINE_VERSION, result, profileIds: [] })
    : null;
  return { analysis_id: id, ...result };
}
