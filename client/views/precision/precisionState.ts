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
  bootstrap: 1000,
  result: null as PrecisionJobResult | null,
};
