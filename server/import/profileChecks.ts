import type { IssueCollector } from "./importError.ts";
import type { RawProfile } from "./rawTables.ts";
import { listEmbryos, type WarningCollector } from "./warningCollector.ts";

export const MIN_POINTS = 5;

function profileName(p: RawProfile, channel: string): string {
  return `embryo "${p.embryo}", channel "${channel}"${p.timeS !== null ? `, time ${p.timeS} s` : ""}`;
}

/** Errors: too few points, positions that do not strictly increase. */
export function checkProfile(p: RawProfile, channel: string, file: string, issues: IssueCollector): void {
  const n = p.positions.length;
  if (n < MIN_POINTS) {
    const where = n > 0 ? { file, row: p.rows[0] } : { file };
    issues.add(where, `${profileName(p, channel)}: only ${n} point${n === 1 ? " has a value" : "s have values"}; at least ${MIN_POINTS} are needed for any analysis`);
    return;
  }
  for (let i = 1; i < n; i++) {
    const a = p.positions[i - 1];
    const b = p.positions[i];
    if (b === a) {
      issues.add({ file, row: p.rows[i] }, `${profileName(p, channel)}: position ${b} appears twice (rows ${p.rows[i - 1]} and ${p.rows[i]}); each position may appear once per profile`);
      return;
    }
    if (b < a) {
      issues.add({ file, row: p.rows[i] }, `${profileName(p, channel)}: positions must increase along a profile, but ${b} (row ${p.rows[i]}) follows ${a} (row ${p.rows[i - 1]})`);
      return;
    }
  }
}

/**
 * True when the far end is brighter than the source end: the mean of the last
 * quarter of points exceeds the mean of the first quarter.
 */
export function risesAwayFromSource(intensities: ArrayLike<number>): boolean {
  const n = intensities.length;
  const q = Math.max(1, Math.floor(n / 4));
  let first = 0;
  let last = 0;
  for (let i = 0; i < q; i++) {
    first += intensities[i];
    last += intensities[n - 1 - i];
  }
  return last > first;
}

/** Points sitting exactly at the profile's maximum; 3 or more (and ≥ 2% of points) suggests a saturated detector. */
export function saturatedPointCount(intensities: ArrayLike<number>): number {
  let max = -Infinity;
  for (let i = 0; i < intensities.length; i++) max = Math.max(max, intensities[i]);
  let count = 0;
  for (let i = 0; i < intensities.length; i++) if (intensities[i] === max) count++;
  return count >= 3 && count >= 0.02 * intensities.length ? count : 0;
}

/** Warnings that do not stop an import: saturation, rising profiles, negative intensities. */
export function warnAboutProfile(p: RawProfile, warnings: WarningCollector, flipAuto: boolean): void {
  const sat = saturatedPointCount(p.intensities);
  if (sat > 0) {
    warnings.add(
      "saturated",
      p.embryo,
      (e) => `${e.length} profile${e.length > 1 ? "s have" : " has"} several points at exactly the maximum value, as a saturated detector gives (${listEmbryos(e)})`,
      "exclude the plateau with a fit window (e.g. --window 30:), or re-image with a lower gain",
    );
  }
  if (risesAwayFromSource(p.intensities)) {
    warnings.add(
      flipAuto ? "flipped" : "rising",
      p.embryo,
      (e) =>
        flipAuto
          ? `${e.length} profile${e.length > 1 ? "s were" : " was"} reversed because intensity rose away from the source end (${listEmbryos(e)})`
          : `${e.length} profile${e.length > 1 ? "s rise" : " rises"} away from the source end; ${e.length > 1 ? "these embryos may be" : "this embryo may be"} imaged end to end (${listEmbryos(e)})`,
      flipAuto ? "check the flipped embryos; import with --flip none to keep them as written" : "import with --flip auto to reverse such profiles, or check the embryo's orientation",
    );
  }
  const negatives = p.intensities.filter((v) => v < 0).length;
  if (negatives > 0) {
    warnings.add(
      "negative",
      p.embryo,
      (e) => `${e.length} profile${e.length > 1 ? "s have" : " has"} negative intensities, as over-subtracted background gives (${listEmbryos(e)})`,
      "fits include a background term, so this is usually harmless; check the background subtraction of the export",
    );
  }
}
