import { studentTQuantile } from "../stats/studentT.ts";

const cache = new Map<number, number>();

/**
 * Two-sided 95% Student-t multiplier t_{0.975}(df), memoised by df because
 * every fit of a batch asks for the same few values and the quantile is
 * found by iteration.
 */
export function tQuantile95(df: number): number {
  let t = cache.get(df);
  if (t === undefined) {
    t = studentTQuantile(0.975, df);
    if (cache.size > 10_000) cache.clear();
    cache.set(df, t);
  }
  return t;
}
