/** A FRAP table as read: times (s) and the columns it had. */
export interface RawRecovery {
  timesS: number[];
  /** Mean intensity in the bleached region (a.u.); absent when the table holds a normalised curve. */
  bleached: number[] | null;
  /** Mean intensity in an unbleached reference region (a.u.), for acquisition bleaching. */
  reference: number[] | null;
  /** Background outside the sample (a.u.). */
  background: number[] | null;
  /** An already normalised curve (pre-bleach ≈ 1). */
  normalised: number[] | null;
  /** Frames flagged as pre-bleach; null when pre-bleach frames are those at t < 0. */
  preBleach: boolean[] | null;
}

export interface NormalisedRecovery {
  /** Post-bleach times (s) measured from the bleach. */
  timesS: number[];
  values: number[];
  preBleachFrames: number;
  /** The normalisation, step by step, in words. */
  steps: string[];
}

/**
 * Normalise a recovery curve to its pre-bleach level:
 *   F(t) = [(I(t) − B(t)) / ⟨I − B⟩_pre] · [⟨R − B⟩_pre / (R(t) − B(t))],
 * i.e. background subtraction, correction for bleaching during acquisition by
 * the reference region, and division by the pre-bleach mean ("double
 * normalisation"; Phair & Misteli 2000, Nature 404:604 [value from memory]).
 * Pre-bleach frames are those at t < 0, or those flagged; with flags the bleach
 * is placed at the last pre-bleach frame and times are shifted to start there.
 */
export function normaliseRecovery(raw: RawRecovery): NormalisedRecovery {
  const n = raw.timesS.length;
  const flagged = raw.preBleach !== null;
  const isPre = raw.preBleach ?? raw.timesS.map((t) => t < 0);
  const preIdx = [...Array(n).keys()].filter((i) => isPre[i]);
  const postIdx = [...Array(n).keys()].filter((i) => !isPre[i]);
  const steps: string[] = [];
  let origin = 0;
  if (flagged && preIdx.length > 0) {
    origin = Math.max(...preIdx.map((i) => raw.timesS[i]));
    if (origin !== 0) steps.push(`times shifted by ${-origin} s so that the bleach (taken at the last flagged pre-bleach frame) is at t = 0`);
  }
  const times = postIdx.map((i) => raw.timesS[i] - origin);
  if (raw.normalised) {
    steps.push("the curve was already normalised (pre-bleach = 1); used as given");
    if (preIdx.length > 0) {
      const pre = mean(preIdx.map((i) => raw.normalised![i]));
      steps.push(`its ${preIdx.length} pre-bleach frames average ${pre.toPrecision(4)}`);
    }
    return { timesS: times, values: postIdx.map((i) => raw.normalised![i]), preBleachFrames: preIdx.length, steps };
  }
  if (!raw.bleached) throw new RangeError("normaliseRecovery: need a bleached-region or a normalised column");
  if (preIdx.length === 0) throw new RangeError("normaliseRecovery: need pre-bleach frames to normalise raw intensities");
  const bg = raw.background ?? new Array<number>(n).fill(0);
  steps.push(raw.background ? "background column subtracted from the bleached and reference regions, frame by frame" : "no background column: no background subtracted (the curve then reads as if background were 0)");
  const b = raw.bleached.map((v, i) => v - bg[i]);
  let corrected = b;
  if (raw.reference) {
    const r = raw.reference.map((v, i) => v - bg[i]);
    const rPre = mean(preIdx.map((i) => r[i]));
    corrected = b.map((v, i) => (v * rPre) / r[i]);
    steps.push("divided by the reference region relative to its pre-bleach mean (corrects bleaching during acquisition)");
  } else steps.push("no reference column: bleaching during acquisition not corrected");
  const pre = mean(preIdx.map((i) => corrected[i]));
  steps.push(`divided by the mean of ${preIdx.length} pre-bleach frame${preIdx.length === 1 ? "" : "s"}`);
  return { timesS: times, values: postIdx.map((i) => corrected[i] / pre), preBleachFrames: preIdx.length, steps };
}

function mean(v: number[]): number {
  return v.reduce((a, b) => a + b, 0) / v.length;
}
