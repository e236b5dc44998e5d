import { modelRegistry } from "../../../server/analysis/models/modelRegistry.ts";
import type { ModelName } from "../../../server/analysis/models/steadyStateModel.ts";
import type { Random } from "../../../server/analysis/random/seededRandom.ts";

/** A·g(x; θ) + B from the model's own basis, plus Gaussian noise of SD `noiseSd` when a generator is given. */
export function simulateProfile(
  model: ModelName,
  x: readonly number[],
  theta: readonly number[],
  amplitude: number,
  background: number,
  options: { lengthUm?: number; noiseSd?: number; random?: Random } = {},
): number[] {
  const g = new Float64Array(x.length);
  modelRegistry[model].basis(Float64Array.from(x), Float64Array.from(theta), options.lengthUm ?? Infinity, g, null);
  return Array.from(g, (v) => amplitude * v + background + (options.random ? (options.noiseSd ?? 0) * options.random.normal() : 0));
}

/** Evenly spaced positions from a to b inclusive. */
export function positions(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));
}

/** Paths of every NaN or ±Infinity inside a plain value (objects, arrays, numbers). */
export function nonFinitePaths(value: unknown, path = "$"): string[] {
  if (typeof value === "number") return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFinitePaths(v, `${path}[${i}]`));
  if (value !== null && typeof value === "object")
    return Object.entries(value as Record<string, unknown>).flatMap(([k, v]) => nonFinitePaths(v, `${path}.${k}`));
  return [];
}
