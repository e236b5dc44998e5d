import type { WorkEstimate } from "./computeBudget.ts";
import { gridPointCount } from "./computeBudget.ts";
import type { PreparedComparison } from "./groups/compareService.ts";
import type { PreparedPlan, PreparedTracking } from "./groups/trackService.ts";
import type { PrecisionTaskInput } from "./precision/precisionTask.ts";

const groupCount = (records: { group: string }[]) => Math.max(1, new Set(records.map((r) => r.group)).size);

/** Group comparison: every group is bootstrapped and every contrast permuted, over its embryos. */
export function compareWork(p: PreparedComparison): WorkEstimate {
  const { permutations, bootstrap } = p.task.options;
  const n = p.task.records.length;
  const g = groupCount(p.task.records);
  return { units: ((permutations ?? 0) + (bootstrap ?? 0)) * n * g, description: `(${permutations} permutations + ${bootstrap} bootstrap resamples) × ${n} embryos × ${g} groups` };
}

/** Tracking: bootstrap resamples over the embryos. */
export function trackWork(p: PreparedTracking): WorkEstimate {
  const bootstrap = p.request.bootstrap;
  const n = p.task.records.length;
  return { units: bootstrap * n, description: `${bootstrap} bootstrap resamples × ${n} embryos` };
}

/** Sample-size plan: every simulated experiment may run its own permutation test. */
export function planWork(p: PreparedPlan): WorkEstimate {
  const { simulations, permutationSimulations } = p.request;
  return { units: simulations * (1 + permutationSimulations), description: `${simulations} simulated experiments × (1 + ${permutationSimulations} permutations each)` };
}

/** Precision: resamples of whole embryos, each over every grid point; the grid itself is capped too. */
export function precisionWork(input: PrecisionTaskInput): WorkEstimate {
  const r = input.request;
  let units = 0;
  let gridPoints = 0;
  let embryos = 0;
  for (const g of input.groups) {
    const profiles = g.channels.flatMap((c) => c.profiles);
    let lo = Infinity;
    let hi = -Infinity;
    let native = 0;
    for (const p of profiles) {
      const x = p.positionUm;
      const scale = r.coords === "relative" && p.lengthUm ? 1 / p.lengthUm : 1;
      lo = Math.min(lo, x[0] * scale);
      hi = Math.max(hi, x[x.length - 1] * scale);
      native = Math.max(native, x.length);
    }
    const span = r.range ? r.range[1] - r.range[0] : hi - lo;
    const points = gridPointCount(span, r.spacing, native);
    const n = g.channels[0]?.profiles.length ?? 0;
    gridPoints = Math.max(gridPoints, points);
    embryos += n;
    units += (r.bootstrap + 1) * Math.max(n, 1) * points * (r.kernelDensity ? Math.max(n, 1) : 1);
  }
  return {
    units,
    gridPoints,
    description: `(${r.bootstrap} bootstrap resamples + 1) × ${embryos} embryos × ${Number.isFinite(gridPoints) ? gridPoints : "unbounded"} grid points${r.kernelDensity ? " × embryos (kernel densities)" : ""}`,
  };
}
