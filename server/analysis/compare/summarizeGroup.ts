import type { Estimate } from "../estimate.ts";
import { createRandom } from "../random/seededRandom.ts";
import { bootstrapInterval, type BootstrapMethod } from "../stats/bootstrapInterval.ts";
import { standardDeviation } from "../stats/descriptive.ts";
import type { GroupExtras } from "./compareOptions.ts";
import { deriveSeed } from "./deriveSeed.ts";
import type { EmbryoRecord, ExcludedEmbryo } from "./embryoRecord.ts";
import { summarizeMetric, type MetricSummary } from "./summarizeMetric.ts";

/** Embryo-to-embryo SD of boundary positions, with its CI. */
export interface BoundarySpread extends Estimate {
  /** Embryos with a boundary ('embryos'), or null for a supplied value. */
  n: number | null;
  source: "embryos" | "supplied";
}

/** Everything reported about one group. */
export interface GroupSummary {
  name: string;
  /** Embryos used (converged, not excluded). */
  n: number;
  lambda_um: MetricSummary | null;
  amplitude_au: MetricSummary | null;
  /** amplitude − background, for embryos that have both. */
  amplitude_corrected_au: MetricSummary | null;
  boundary_um: MetricSummary | null;
  boundary_sd_um: BoundarySpread | null;
  /** Minimal positional error σ_x in µm, as supplied (no per-embryo values exist). */
  sigma_x_min_um: Estimate | null;
  /** λ from a global fit of the group's profiles, as supplied. */
  lambda_global_um: Estimate | null;
  excluded: ExcludedEmbryo[];
}

export interface SummarizeGroupOptions {
  bootstrap: number;
  level: number;
  interval: BootstrapMethod;
  seed: number;
}

/** Summaries of every metric present in the group; each bootstrap stream is seeded from the group name and metric. */
export function summarizeGroup(
  name: string,
  records: readonly EmbryoRecord[],
  excluded: readonly ExcludedEmbryo[],
  extras: GroupExtras | undefined,
  options: SummarizeGroupOptions,
): GroupSummary {
  const summarize = (metric: string, values: number[]): MetricSummary | null =>
    summarizeMetric(values, { ...options, random: createRandom(deriveSeed(options.seed, `summary:${name}:${metric}`)) });
  const pick = (f: (r: EmbryoRecord) => number | undefined): number[] =>
    records.map(f).filter((v): v is number => v !== undefined && Number.isFinite(v));
  const boundaries = pick((r) => r.boundaryUm);
  return {
    name,
    n: records.length,
    lambda_um: summarize("lambda", pick((r) => r.lambdaUm)),
    amplitude_au: summarize("amplitude", pick((r) => r.amplitude)),
    amplitude_corrected_au: summarize("amplitude_corrected",
      pick((r) => (r.amplitude !== undefined && r.background !== undefined ? r.amplitude - r.background : undefined))),
    boundary_um: summarize("boundary", boundaries),
    boundary_sd_um: boundarySpread(name, boundaries, extras, options),
    sigma_x_min_um: extras?.sigmaXMinUm ?? null,
    lambda_global_um: extras?.lambdaGlobalUm ?? null,
    excluded: [...excluded],
  };
}

function boundarySpread(name: string, boundaries: number[], extras: GroupExtras | undefined, options: SummarizeGroupOptions): BoundarySpread | null {
  if (boundaries.length >= 3) {
    const boot = bootstrapInterval([boundaries], ([x]) => standardDeviation(x), {
      resamples: options.bootstrap, level: options.level, method: options.interval,
      random: createRandom(deriveSeed(options.seed, `summary:${name}:boundary_sd`)),
    });
    return { value: boot.value, se: boot.se, ci95: boot.interval, n: boundaries.length, source: "embryos" };
  }
  if (extras?.boundarySdUm) return { ...extras.boundarySdUm, n: null, source: "supplied" };
  return null;
}
