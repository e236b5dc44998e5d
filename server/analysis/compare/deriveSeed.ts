/**
 * A sub-seed for one named step of an analysis (e.g. "contrast:wt:bcd-2x"),
 * so each bootstrap or permutation stream depends only on the run's seed and
 * its own label — not on how many other steps ran before it. FNV-1a over the
 * label (Fowler, Noll & Vo), mixed with the seed by a murmur3 finalizer.
 */
export function deriveSeed(seed: number, label: string): number {
  let h = 0x811c9dc5 ^ (Math.floor(seed) >>> 0);
  for (let i = 0; i < label.length; i++) {
    h ^= label.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  h ^= Math.floor(seed / 4294967296) >>> 0;
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b) >>> 0;
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35) >>> 0;
  return (h ^ (h >>> 16)) >>> 0;
}
