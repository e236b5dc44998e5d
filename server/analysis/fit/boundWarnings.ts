import type { SteadyStateModel } from "../models/steadyStateModel.ts";
import { formatNumber } from "./formatNumber.ts";

/**
 * Warnings for fitted nonlinear parameters that ended on a bound: the data
 * do not determine them. (A length scale on its upper bound is not warned
 * about here: the fitters report it as "no decay".)
 */
export function boundWarnings(
  model: SteadyStateModel,
  resolved: { free: number[]; lower: number[]; upper: number[] },
  atBound: Int8Array,
  warnings: string[],
): void {
  resolved.free.forEach((j, k) => {
    const name = model.parameters[j].name;
    if (atBound[k] === -1)
      warnings.push(`${name} sits at its lower limit (${formatNumber(resolved.lower[k])}): it is not resolved by the sampling; fix it or check the profile near the source`);
    else if (atBound[k] === 1 && j !== 0)
      warnings.push(`${name} sits at its upper limit (${formatNumber(resolved.upper[k])}): the data do not determine it; fix it to a measured value`);
  });
}
