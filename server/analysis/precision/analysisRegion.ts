/**
 * The stated region over which positional information, the headline σ_x and decoding are
 * computed. It is fixed before any noise is looked at: given by the caller, or the span covered
 * by every profile trimmed by a fixed fraction at each end. It never shrinks because of noisy
 * or masked positions; those are handled inside it (see regionSigma.ts).
 */
export interface AnalysisRegion {
  /** Ends of the region in grid units (µm, or fraction of embryo length). */
  from: number;
  to: number;
  /** to − from: the L of the uniform prior. */
  length: number;
  source: "requested" | "default";
  /** How the region was chosen, in words, e.g. "span covered by every profile (0–400), trimmed by 10% at each end". */
  description: string;
  /** First and last grid index inside [from, to] (inclusive); integrals also use the exact ends. */
  startIndex: number;
  endIndex: number;
}

/** Fewest grid points a region must contain (an integral needs a few points to mean anything). */
export const MIN_REGION_POINTS = 3;

/** Where a region's integration nodes sit on the grid: node j lies at fraction t[j] between grid points lower[j] and lower[j] + 1. */
export interface RegionNodes {
  x: Float64Array;
  lower: Int32Array;
  t: Float64Array;
}

/**
 * The default region: `span` (the range covered by every profile) trimmed by `trimFraction`
 * of its length at each end. The ends of a profile are where Savitzky–Golay derivatives become
 * one-sided, where a source plateau or dip sits, and where the far end meets the background; a
 * fixed fraction keeps the choice independent of the noise (common practice, no source).
 */
export function defaultRegionRange(span: [number, number], trimFraction: number): [number, number] {
  const cut = trimFraction * (span[1] - span[0]);
  return [span[0] + cut, span[1] - cut];
}

/**
 * Resolve a region on the grid. Throws a RangeError naming the region and the grid when the
 * region reaches beyond the grid or holds fewer than MIN_REGION_POINTS grid points: a region is
 * never clipped or shrunk silently.
 */
export function resolveRegion(gridX: ArrayLike<number>, range: [number, number], source: AnalysisRegion["source"], description: string): AnalysisRegion {
  const g = gridX.length;
  const [from, to] = range;
  const tolerance = 1e-9 * (gridX[g - 1] - gridX[0]);
  if (!(to > from)) throw new RangeError(`region ${from} to ${to}: the start must be below the end`);
  if (from < gridX[0] - tolerance || to > gridX[g - 1] + tolerance)
    throw new RangeError(`region ${fmt(from)} to ${fmt(to)} reaches beyond the grid ${fmt(gridX[0])} to ${fmt(gridX[g - 1])} (where every profile has data); choose a region inside it`);
  let startIndex = 0;
  while (startIndex < g && gridX[startIndex] < from - tolerance) startIndex++;
  let endIndex = g - 1;
  while (endIndex >= 0 && gridX[endIndex] > to + tolerance) endIndex--;
  if (endIndex - startIndex + 1 < MIN_REGION_POINTS)
    throw new RangeError(`region ${fmt(from)} to ${fmt(to)} holds ${Math.max(0, endIndex - startIndex + 1)} grid points; at least ${MIN_REGION_POINTS} are needed (use a wider region or a finer grid)`);
  return { from: Math.max(from, gridX[0]), to: Math.min(to, gridX[g - 1]), length: Math.min(to, gridX[g - 1]) - Math.max(from, gridX[0]), source, description, startIndex, endIndex };
}

/**
 * The region of an analysis: the requested one, or the default span (the range covered by every
 * profile, or a span given by a caller analysing several groups) trimmed at each end.
 */
export function stateRegion(
  gridX: ArrayLike<number>,
  gridRange: [number, number],
  requested: [number, number] | null,
  defaults: { span: [number, number] | null; trimFraction: number },
): AnalysisRegion {
  if (requested) return resolveRegion(gridX, requested, "requested", "requested");
  const span = defaults.span ?? gridRange;
  const percent = `${Number((100 * defaults.trimFraction).toPrecision(3))}%`;
  const whose = defaults.span ? "every profile of every group in this analysis" : "every profile";
  const description = `span covered by ${whose} (${fmt(span[0])}–${fmt(span[1])}), trimmed by ${percent} at each end`;
  return resolveRegion(gridX, defaultRegionRange(span, defaults.trimFraction), "default", description);
}

/** Integration nodes of a region: its exact ends plus every grid point strictly inside it. */
export function regionNodes(gridX: ArrayLike<number>, region: AnalysisRegion): RegionNodes {
  const g = gridX.length;
  const tolerance = 1e-9 * (gridX[g - 1] - gridX[0]);
  const x: number[] = [region.from];
  for (let k = region.startIndex; k <= region.endIndex; k++) if (gridX[k] > region.from + tolerance && gridX[k] < region.to - tolerance) x.push(gridX[k]);
  x.push(region.to);
  const lower = new Int32Array(x.length);
  const t = new Float64Array(x.length);
  let k = 0;
  x.forEach((v, j) => {
    while (k < g - 2 && gridX[k + 1] <= v + tolerance) k++;
    lower[j] = k;
    t[j] = Math.min(1, Math.max(0, (v - gridX[k]) / (gridX[k + 1] - gridX[k])));
  });
  return { x: Float64Array.from(x), lower, t };
}

/** Values on the grid linearly interpolated onto the region's nodes. */
export function onNodes(nodes: RegionNodes, values: ArrayLike<number>, out = new Float64Array(nodes.x.length)): Float64Array {
  for (let j = 0; j < out.length; j++) {
    const k = nodes.lower[j];
    const t = nodes.t[j];
    out[j] = t === 0 ? values[k] : t === 1 ? values[k + 1] : (1 - t) * values[k] + t * values[k + 1];
  }
  return out;
}

const fmt = (v: number) => String(Number(v.toPrecision(6)));
