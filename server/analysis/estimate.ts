/**
 * A number with its uncertainty: the shape every reported quantity takes, so
 * that no value travels through morphogauge without its error bar.
 */
export interface Estimate {
  value: number;
  /** Standard error, or null when it cannot be estimated (e.g. one embryo). */
  se: number | null;
  /** Two-sided 95% confidence interval [low, high], or null when unavailable. */
  ci95: [number, number] | null;
}

export function estimate(value: number, se: number | null, ci95: [number, number] | null): Estimate {
  return { value, se, ci95 };
}
