import { median, scaledMad } from "./descriptive.ts";

/**
 * Robust z-scores (v − median)/(1.4826·MAD): unlike the ordinary z-score, one
 * extreme value cannot inflate the spread that judges it.
 * Source: Iglewicz & Hoaglin 1993, How to Detect and Handle Outliers (modified z-score).
 * Returns null scores when the MAD is zero (more than half the values are equal).
 */
export function robustZScores(values: ArrayLike<number>): { median: number; scaledMad: number; scores: number[] | null } {
  if (values.length === 0) throw new RangeError("robustZScores: no values");
  const m = median(values);
  const s = scaledMad(values);
  if (!(s > 0)) return { median: m, scaledMad: s, scores: null };
  return { median: m, scaledMad: s, scores: Array.from(values, (v) => (v - m) / s) };
}
