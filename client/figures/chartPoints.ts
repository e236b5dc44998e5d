import { roundSignificant } from "./figureNumbers.ts";

/** A point in data coordinates; y = NaN is a gap, which Chart.js leaves undrawn and does not join across. */
export interface ChartPoint {
  x: number;
  y: number;
}

const finite = (v: number | null | undefined): number => (v === null || v === undefined || !Number.isFinite(v) ? NaN : roundSignificant(v));

/** Points from parallel arrays; a missing or non-finite value becomes a gap. */
export function chartPoints(x: ArrayLike<number>, y: ArrayLike<number | null>): ChartPoint[] {
  const n = Math.min(x.length, y.length);
  const out: ChartPoint[] = [];
  for (let i = 0; i < n; i++) out.push({ x: finite(x[i]), y: finite(y[i]) });
  return out;
}

/** Line segments (error bars, markers) drawn by one dataset: each pair of ends followed by a gap. */
export function segmentPoints(segments: readonly (readonly [ChartPoint, ChartPoint])[]): ChartPoint[] {
  const out: ChartPoint[] = [];
  for (const [a, b] of segments) {
    out.push({ x: finite(a.x), y: finite(a.y) }, { x: finite(b.x), y: finite(b.y) }, { x: finite(b.x), y: NaN });
  }
  return out;
}
