import type { ModelName, SteadyStateModel } from "./steadyStateModel.ts";
import { exponentialModel } from "./exponential.ts";
import { finiteModel } from "./finite.ts";
import { sourceModel } from "./source.ts";
import { powerModel } from "./power.ts";
import { powerFreeModel } from "./powerFree.ts";

/** Every steady-state model by its name, the key used in fit options. */
export const modelRegistry: Readonly<Record<ModelName, SteadyStateModel>> = {
  exponential: exponentialModel,
  finite: finiteModel,
  source: sourceModel,
  power: powerModel,
  "power-free": powerFreeModel,
};
