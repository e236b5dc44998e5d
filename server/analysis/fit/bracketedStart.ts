import { brentMinimize } from "./brentMinimize.ts";
import type { ProjectedProblem } from "./projectedProblem.ts";

/**
 * A start that needs no guess: scan the first free parameter (the length
 * scale λ or x0) over its whole bracket on a log grid — for each of a few
 * values of a second free parameter, when there is one — then refine the
 * best grid cell with Brent's method on log λ. The reduced (projected) RSS
 * is a function of the nonlinear parameters only, so this search covers the
 * whole problem. Used when Levenberg–Marquardt from the data-driven guess
 * fails or ends on a bound; its result is then polished by Levenberg–Marquardt.
 */
export function bracketedStart(
  problem: ProjectedProblem,
  start: ArrayLike<number>,
  lower: ArrayLike<number>,
  upper: ArrayLike<number>,
  gridPoints = 25,
): Float64Array {
  const p = problem.free.length;
  const best = Float64Array.from(start);
  if (p === 0) return best;
  const trial = Float64Array.from(start);
  const rssAt = (values: Float64Array) => (problem.evaluate(values, false) ? problem.rss : Infinity);

  const logLo = Math.log(lower[0]);
  const logHi = Math.log(upper[0]);
  const grid = Float64Array.from({ length: gridPoints }, (_, i) => logLo + ((logHi - logLo) * i) / (gridPoints - 1));
  const secondary = p >= 2 ? secondaryValues(start[1], lower[1], upper[1]) : [NaN];

  let bestRss = Infinity;
  let bestIndex = -1;
  for (const s of secondary) {
    if (p >= 2) trial[1] = s;
    for (let i = 0; i < gridPoints; i++) {
      trial[0] = Math.exp(grid[i]);
      const rss = rssAt(trial);
      if (rss < bestRss) {
        bestRss = rss;
        bestIndex = i;
        best.set(trial);
      }
    }
  }
  if (bestIndex < 0) return Float64Array.from(start);

  trial.set(best);
  const lo = grid[Math.max(bestIndex - 1, 0)];
  const hi = grid[Math.min(bestIndex + 1, gridPoints - 1)];
  const refined = brentMinimize(
    (logValue) => {
      trial[0] = Math.exp(logValue);
      return rssAt(trial);
    },
    lo,
    hi,
    0,
    1e-7,
  );
  if (refined.fx <= bestRss) best[0] = Math.exp(refined.x);
  return best;
}

/** The caller's value of a second parameter and six values spread log-evenly over its bounds. */
function secondaryValues(start: number, lower: number, upper: number): number[] {
  const out = [start];
  const a = Math.log(lower);
  const b = Math.log(upper);
  for (let i = 0; i < 6; i++) out.push(Math.exp(a + ((b - a) * (i + 0.5)) / 6));
  return out;
}
