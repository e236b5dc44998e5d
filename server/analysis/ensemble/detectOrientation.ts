import { quantileSorted } from "../stats/descriptive.ts";

/** Orientation of each embryo relative to the group. */
export interface OrientationCheck {
  /** Reference the embryos are compared with. */
  reference: "pointwise median profile";
  /** Whether the reference falls or rises along the grid (sign of its correlation with position). */
  groupTrend: "falls" | "rises" | "flat";
  /** Pearson correlation of each embryo with the reference; null when either is constant. */
  correlations: { embryo: string; correlation: number | null }[];
  /** Embryos whose profile runs against the group (negative correlation with the reference). */
  flagged: string[];
}

/**
 * Find profiles that rise where the group falls (or the reverse), e.g. embryos
 * imaged end to end. The pointwise median is the reference because it is not
 * pulled over by a minority of reversed embryos; a negative Pearson
 * correlation with it flags an embryo.
 */
export function detectOrientation(embryos: readonly string[], values: readonly ArrayLike<number>[], gridX: ArrayLike<number>): OrientationCheck {
  const n = values.length;
  const g = gridX.length;
  const reference = new Float64Array(g);
  const column = new Float64Array(n);
  for (let k = 0; k < g; k++) {
    for (let i = 0; i < n; i++) column[i] = values[i][k];
    column.sort();
    reference[k] = quantileSorted(column, 0.5);
  }
  const trend = pearson(reference, gridX);
  const correlations = embryos.map((embryo, i) => ({ embryo, correlation: pearson(values[i], reference) }));
  return {
    reference: "pointwise median profile",
    groupTrend: trend === null ? "flat" : trend < 0 ? "falls" : "rises",
    correlations,
    flagged: correlations.filter((c) => c.correlation !== null && c.correlation < 0).map((c) => c.embryo),
  };
}

function pearson(a: ArrayLike<number>, b: ArrayLike<number>): number | null {
  const n = a.length;
  let ma = 0, mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i];
    mb += b[i];
  }
  ma /= n;
  mb /= n;
  let sab = 0, saa = 0, sbb = 0;
  for (let i = 0; i < n; i++) {
    const da = a[i] - ma;
    const db = b[i] - mb;
    sab += da * db;
    saa += da * da;
    sbb += db * db;
  }
  if (!(saa > 0 && sbb > 0)) return null;
  return sab / Math.sqrt(saa * sbb);
}
