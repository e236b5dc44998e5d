/**
 * Reusable per-point work arrays. Allocating a typed array costs about as
 * much as several passes over a 500-point profile (its memory lives outside
 * the JavaScript heap), so a batch of fits would spend much of its time
 * allocating. Fits take their arrays here and give them back when done;
 * arrays are handed out uninitialised (holding old values).
 *
 * Fits are synchronous and results never hold these arrays (they copy what
 * they report), so an array is never in use by two fits at once.
 */
const pool = new Map<string, Float64Array[][]>();
const maxPerShape = 4;

/** `count` arrays of `length` doubles, views on one shared buffer. */
export function acquireArrays(length: number, count: number): Float64Array[] {
  const free = pool.get(`${length}:${count}`);
  const reused = free?.pop();
  if (reused) return reused;
  const buffer = new ArrayBuffer(8 * length * count);
  return Array.from({ length: count }, (_, k) => new Float64Array(buffer, 8 * length * k, length));
}

/** Return arrays from {@link acquireArrays}; the caller must not use them afterwards. */
export function releaseArrays(arrays: Float64Array[]): void {
  if (arrays.length === 0) return;
  const key = `${arrays[0].length}:${arrays.length}`;
  let free = pool.get(key);
  if (!free) {
    // Bound the number of shapes kept: profiles of many lengths would otherwise pile up.
    if (pool.size >= 64) pool.clear();
    free = [];
    pool.set(key, free);
  }
  if (free.length < maxPerShape) free.push(arrays);
}
