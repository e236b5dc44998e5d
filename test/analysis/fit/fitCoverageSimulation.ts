import { FitOptions, type FitOptionsInput } from "../../../server/analysis/fit/fitOptions.ts";
import { fitProfile } from "../../../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

/**
 * Per-embryo λ coverage under realistic fluorescence noise: each intensity is
 * μ·(1 + 0.1·ε₁) + 1·ε₂ a.u. (10% multiplicative plus additive noise of SD 1,
 * on an amplitude of 100 over a background of 10), 60 points on 0–300 µm;
 * exponential λ = 60 µm, or finite-domain λ = 120 µm with L = 300 µm.
 * Returns the fraction of 95% intervals that contain the true λ.
 */
export function lambdaCoverage(model: "exponential" | "finite", replicates: number, seed: number, options: FitOptionsInput = {}): { coverage: number; fitted: number } {
  const random = createRandom(seed);
  const x = positions(0, 300, 60);
  const lengthUm = model === "finite" ? 300 : undefined;
  const lambdaUm = model === "finite" ? 120 : 60;
  const resolved = FitOptions.parse({ ...options, model });
  const mu = simulateProfile(model, x, [lambdaUm], 100, 10, { lengthUm });
  let covered = 0;
  let fitted = 0;
  for (let r = 0; r < replicates; r++) {
    const y = mu.map((m) => m * (1 + 0.1 * random.normal()) + random.normal());
    const fit = fitProfile(x, y, resolved, { lengthUm });
    if (!fit.ok || fit.parameters.lambdaUm.ci95 === null) continue;
    fitted++;
    const [lo, hi] = fit.parameters.lambdaUm.ci95;
    if (lo <= lambdaUm && lambdaUm <= hi) covered++;
  }
  return { coverage: covered / Math.max(fitted, 1), fitted };
}
