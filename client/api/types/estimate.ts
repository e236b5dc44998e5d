/** A reported quantity: value, standard error and 95% CI (either may be missing). */
export interface Estimate {
  value: number;
  se?: number | null;
  ci95?: [number, number] | null;
}

/** A fitted or derived parameter with its unit. */
export interface Parameter extends Estimate {
  unit: string;
  fixed: boolean;
}

/** Descriptive statistics of one group's per-embryo values. */
export interface GroupSummary {
  n: number;
  mean: number;
  sd: number;
  sem: number;
  median: number;
  cv: number;
  ci95: [number, number] | null;
  /** How ci95 was formed (a t interval). */
  ci_method?: string;
  /** Bootstrap CI of the mean, a second opinion. */
  bootstrap_ci95?: [number, number] | null;
}
