/**
 * One embryo's fluorescence-intensity profile along the axis, positions in µm
 * from the source end, ascending. Several channels measured in the same
 * embryos come as one group of profiles per channel with matching labels.
 */
export interface Profile {
  embryo: string;
  positionUm: ArrayLike<number>;
  intensity: ArrayLike<number>;
  /** Embryo length in µm; needed for relative (x/L) coordinates and length-scaling analyses. */
  lengthUm?: number;
}

/** Grid coordinates: µm from the source end, or the fraction x/L of each embryo's length. */
export type Coordinates = "absolute" | "relative";

/**
 * Check a group of profiles for the structural rules every analysis relies on;
 * throws a RangeError that names the embryo, the field and the value.
 */
export function checkProfiles(profiles: readonly Profile[], coords: Coordinates): void {
  const seen = new Set<string>();
  for (const p of profiles) {
    const label = `embryo "${p.embryo}"`;
    if (seen.has(p.embryo)) throw new RangeError(`${label} appears twice in one group; embryo labels must be unique`);
    seen.add(p.embryo);
    const n = p.positionUm.length;
    if (p.intensity.length !== n)
      throw new RangeError(`${label}: positionUm has ${n} values but intensity has ${p.intensity.length}`);
    if (n < 2) throw new RangeError(`${label}: needs at least 2 points, got ${n}`);
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(p.positionUm[i])) throw new RangeError(`${label}, point ${i}: positionUm ${p.positionUm[i]} is not a finite number`);
      if (!Number.isFinite(p.intensity[i])) throw new RangeError(`${label}, point ${i}: intensity ${p.intensity[i]} is not a finite number`);
      if (i > 0 && !(p.positionUm[i] > p.positionUm[i - 1]))
        throw new RangeError(`${label}, point ${i}: positionUm must ascend strictly, got ${p.positionUm[i - 1]} then ${p.positionUm[i]}`);
    }
    if (p.lengthUm !== undefined && !(p.lengthUm > 0 && Number.isFinite(p.lengthUm)))
      throw new RangeError(`${label}: lengthUm must be a positive number, got ${p.lengthUm}`);
    if (coords === "relative" && p.lengthUm === undefined)
      throw new RangeError(`${label}: relative coordinates need lengthUm for every embryo`);
  }
}

/** True when every profile states its length. */
export function allLengthsKnown(profiles: readonly Profile[]): boolean {
  return profiles.length > 0 && profiles.every((p) => p.lengthUm !== undefined);
}
