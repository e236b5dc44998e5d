export { PlanOptions, type PlanOptionsInput, type ResolvedPlanOptions } from "./planOptions.ts";
export { planSampleSize, type PowerRow, type SamplePlan } from "./planSampleSize.ts";
export { simulateMeanPower, simulateSpreadPower, type MeanPowerSimulation, type SpreadPowerSimulation } from "./simulatePower.ts";
export { mostVariableGroup, type GroupVariability, type PlanningGroupChoice } from "./mostVariableGroup.ts";
