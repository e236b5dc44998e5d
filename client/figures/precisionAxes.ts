import type { PrecisionFigureInput } from "./figureInputs.ts";

/** Axis titles and the length unit of a precision analysis: µm, or fractions of the embryo length in relative coordinates. */
export function precisionAxes(p: Pick<PrecisionFigureInput, "unit" | "normalisation">) {
  const absolute = p.unit === "um";
  return {
    absolute,
    /** Unit of lengths (positions, σ_x, boundary SD) as written after a number. */
    lengthUnit: absolute ? "µm" : "of length",
    position: absolute ? "position from source (µm)" : "position from source, x/L (fraction of length)",
    intensity: p.normalisation === "none" ? "intensity (a.u.)" : `intensity, ${p.normalisation} normalised (a.u.)`,
  };
}

/** "wt / glm, 30 embryos": which analysis a precision figure shows. */
export function precisionLabel(p: Pick<PrecisionFigureInput, "group" | "channel" | "n_embryos">): string {
  return `${p.group} / ${p.channel}, ${p.n_embryos} embryos`;
}
