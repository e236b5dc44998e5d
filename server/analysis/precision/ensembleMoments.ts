/** Mean and across-embryo standard deviation at each grid position. */
export interface EnsembleMoments {
  n: number;
  mean: Float64Array;
  /** Sample standard deviation across embryos (ddof 1). */
  sd: Float64Array;
}

/**
 * Moments over the embryos listed in `indices` (a bootstrap resample may repeat
 * embryos), or over all embryos. Two passes, for accuracy when the mean is
 * large compared with the spread.
 */
export function ensembleMoments(values: readonly ArrayLike<number>[], indices?: ArrayLike<number>): EnsembleMoments {
  const n = indices ? indices.length : values.length;
  if (n < 2) throw new RangeError(`ensembleMoments: needs at least 2 embryos, got ${n}`);
  const g = values[0].length;
  const mean = new Float64Array(g);
  const sd = new Float64Array(g);
  for (let r = 0; r < n; r++) {
    const v = values[indices ? indices[r] : r];
    for (let k = 0; k < g; k++) mean[k] += v[k];
  }
  for (let k = 0; k < g; k++) mean[k] /= n;
  for (let r = 0; r < n; r++) {
    const v = values[indices ? indices[r] : r];
    for (let k = 0; k < g; k++) sd[k] += (v[k] - mean[k]) ** 2;
  }
  for (let k = 0; k < g; k++) sd[k] = Math.sqrt(sd[k] / (n - 1));
  return { n, mean, sd };
}

/** Mean over the listed rows (or all rows) of per-embryo arrays, e.g. per-embryo slopes. */
export function rowMean(rows: readonly ArrayLike<number>[], indices?: ArrayLike<number>): Float64Array {
  const n = indices ? indices.length : rows.length;
  const g = rows[0].length;
  const out = new Float64Array(g);
  for (let r = 0; r < n; r++) {
    const v = rows[indices ? indices[r] : r];
    for (let k = 0; k < g; k++) out[k] += v[k];
  }
  for (let k = 0; k < g; k++) out[k] /= n;
  return out;
}
