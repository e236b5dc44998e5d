import type { PrecisionJobResult } from "../../api/types/precision.ts";

/** The Precision view's settings and last result, kept while the page is open. */
export const precisionState = {
  genotypes: [] as string[],
  channels: [] as string[],
  coords: "absolute",
  normalisation: "none",
  derivative: "savitzky-golay",
  flip: "none",
  boundaryBy: "default" as "threshold" | "position" | "default",
  boundaryValue: undefined as number | undefined,
  positions: "",
  /** Region "from–to" for positional information and the headline σ_x; empty for the default. */
  regionFrom: undefined as number | undefined,
  regionTo: undefined as number | undefined,
  /** Fit window of the model slope; empty ends default to the region. */
  windowFrom: undefined as number | undefined,
  windowTo: undefined as number | undefined,
  bootstrap: 1000,
  result: null as PrecisionJobResult | null,
};
