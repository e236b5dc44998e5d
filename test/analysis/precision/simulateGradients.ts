import type { Profile } from "../../../server/analysis/ensemble/profile.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";

export interface ExponentialGroupSpec {
  embryos: number;
  lambdaUm: number;
  /** Coefficient of variation of the multiplicative log-normal noise. */
  cv: number;
  /** "amplitude": one factor per embryo (smooth profiles); "pointwise": an independent factor at every position. */
  noise: "amplitude" | "pointwise";
  lengthUm?: number;
  spacingUm?: number;
  amplitude?: number;
  /** SD of the per-embryo decay length as a fraction of lambdaUm (0 by default). */
  lambdaCv?: number;
  seed: number;
}

/**
 * Replicate embryos with mean profile A·e^(−x/λ) and multiplicative log-normal noise of
 * constant CV: factor e^(s·z − s²/2) with s² = ln(1 + CV²) has mean 1 and CV exactly CV,
 * so σ_c(x) = CV·c̄(x) and σ_x = λ·CV (METHODS.md §4 [derived]; definition: Gregor et al. 2007, Cell).
 */
export function exponentialGroup(spec: ExponentialGroupSpec): Profile[] {
  const random = createRandom(spec.seed);
  const lengthUm = spec.lengthUm ?? 400;
  const spacingUm = spec.spacingUm ?? 2;
  const amplitude = spec.amplitude ?? 1000;
  const s = Math.sqrt(Math.log(1 + spec.cv ** 2));
  const factor = () => Math.exp(s * random.normal() - (s * s) / 2);
  const x = Float64Array.from({ length: Math.round(lengthUm / spacingUm) + 1 }, (_, k) => k * spacingUm);
  return Array.from({ length: spec.embryos }, (_, i) => {
    const a = spec.noise === "amplitude" ? factor() : 1;
    const lambda = spec.lambdaUm * (1 + (spec.lambdaCv ?? 0) * random.normal());
    const intensity = Float64Array.from(x, (v) => amplitude * a * Math.exp(-v / lambda) * (spec.noise === "pointwise" ? factor() : 1));
    return { embryo: `e${String(i + 1).padStart(3, "0")}`, positionUm: x, intensity, lengthUm };
  });
}

/** Walk a result and collect the paths of every NaN or infinite number. */
export function nonFinitePaths(value: unknown, path = "result"): string[] {
  if (typeof value === "number") return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value) || ArrayBuffer.isView(value))
    return Array.from(value as ArrayLike<unknown>).flatMap((v, i) => nonFinitePaths(v, `${path}[${i}]`));
  if (value && typeof value === "object")
    return Object.entries(value).flatMap(([k, v]) => (typeof v === "function" ? [] : nonFinitePaths(v, `${path}.${k}`)));
  return [];
}
