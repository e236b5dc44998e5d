import type { FigureKind, FigureSourceInputs } from "../../client/figures/figureRegistry.ts";
import { FIGURE_REGISTRY } from "../../client/figures/figureRegistry.ts";
import { comparisonInput, dosageTracking, fitInput, planInput, precisionInput } from "./figureFixtures.ts";
import { buildUpInput, frapInput, simulationInput } from "./dynamicsFixtures.ts";

const BY_SOURCE: FigureSourceInputs = { fit: fitInput, precision: precisionInput, comparison: comparisonInput, tracking: dosageTracking, plan: planInput, dynamics: buildUpInput, frap: frapInput, simulation: simulationInput };

/** The hand-made input of each figure kind's source. */
export function fixtureFor(kind: FigureKind): FigureSourceInputs[keyof FigureSourceInputs] {
  return BY_SOURCE[FIGURE_REGISTRY[kind].source];
}
