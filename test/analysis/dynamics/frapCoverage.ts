import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { fitFrapCurve } from "../../../server/analysis/dynamics/frap/fitFrapCurve.ts";
import { FrapFitOptions } from "../../../server/analysis/dynamics/frap/frapFitOptions.ts";
import { recoveryWithTurnover } from "../../../server/analysis/dynamics/frap/recoveryModel.ts";
import type { FrapGeometry } from "../../../server/analysis/dynamics/frap/recoveryShapes.ts";

export interface CoverageCase {
  geometry: FrapGeometry;
  diffusionUm2PerS: number;
  mobileFraction: number;
  postBleach: number;
  noiseSd: number;
  frames: number;
  frameIntervalS: number;
}

/**
 * Simulate noisy recovery curves with a known D and mobile fraction and count
 * how often the fitted 95% intervals contain them. Recovery starts during the
 * first frame: frame i is taken at (i + ½)·Δt.
 */
export function frapCoverage(c: CoverageCase, replicates: number, seed: number) {
  const rng = createRandom(seed);
  const options = FrapFitOptions.parse({ geometry: c.geometry });
  const times = Array.from({ length: c.frames }, (_, i) => (i + 0.5) * c.frameIntervalS);
  let coverD = 0;
  let coverMf = 0;
  let failed = 0;
  const logRatios: number[] = [];
  for (let r = 0; r < replicates; r++) {
    const values = times.map((t) => c.postBleach + (1 - c.postBleach) * c.mobileFraction * recoveryWithTurnover(c.geometry, t, c.diffusionUm2PerS, 0) + c.noiseSd * rng.normal());
    const fit = fitFrapCurve({ timesS: times, values }, options);
    if (!fit.ok || !fit.diffusionUm2PerS.ci95 || !fit.mobileFraction.ci95) {
      failed++;
      continue;
    }
    const [dLo, dHi] = fit.diffusionUm2PerS.ci95;
    const [mLo, mHi] = fit.mobileFraction.ci95;
    if (dLo <= c.diffusionUm2PerS && c.diffusionUm2PerS <= dHi) coverD++;
    if (mLo <= c.mobileFraction && c.mobileFraction <= mHi) coverMf++;
    logRatios.push(Math.log(fit.diffusionUm2PerS.value / c.diffusionUm2PerS));
  }
  const ok = replicates - failed;
  return { coverageD: coverD / ok, coverageMf: coverMf / ok, failed, medianLogRatio: logRatios.sort((a, b) => a - b)[Math.floor(logRatios.length / 2)] };
}
