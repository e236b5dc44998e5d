import { discretize } from "./discretize.ts";
import type { ReactionDiffusionProblem } from "./reactionDiffusionProblem.ts";
import { solveTridiagonal } from "./solveTridiagonal.ts";

/**
 * The discrete steady state of a linear problem (n = 1): the solution of
 * M·c = −b for the finite-volume system of {@link discretize}, found directly
 * rather than by running the clock. Needs degradation or a fixed end
 * (otherwise there is no steady state).
 */
export function steadyState(problem: ReactionDiffusionProblem): Float64Array {
  if (problem.degradationOrder !== 1) throw new RangeError("steadyState: only for linear degradation (n = 1)");
  const fixedEnd = problem.left.kind === "fixed" || problem.right.kind === "fixed";
  if (!(problem.degradationPerS > 0) && !fixedEnd) throw new RangeError("steadyState: without degradation or a fixed end there is no steady state");
  const s = discretize(problem);
  const n = s.diagonal.length;
  const out = new Float64Array(n);
  const rhs = s.constant.map((b) => -b);
  solveTridiagonal(s.lower, s.diagonal, s.upper, rhs, out, new Float64Array(n));
  return out;
}
