import type { FitJobResult } from "../../api/types/fits.ts";

/** The Fits view's settings and last results, kept while the page is open. */
export const fitsState = {
  genotype: "",
  channel: "",
  models: ["exponential"] as string[],
  xMinUm: undefined as number | undefined,
  xMaxUm: undefined as number | undefined,
  global: true,
  /** The last fit run's result: the only place Akaike weights and the group model ranking are given. */
  lastJob: null as FitJobResult | null,
  selectedFitId: null as number | null,
};
