import type { ComparisonResult, PlanResult, TrackingResult } from "../../api/types/groups.ts";
import type { RecordsSettings } from "./recordsFields.ts";

/** The Groups view's settings and last results, kept while the page is open. */
export const groupsState = {
  compare: {
    records: { genotypes: [], channel: "", fits: "", fitModel: "", includeExcluded: false, threshold: undefined } as RecordsSettings,
    by: "genotype",
    reference: "",
    metric: "lambda",
    permutations: 10000,
    bootstrap: 2000,
    result: null as ComparisonResult | null,
  },
  track: {
    records: { genotypes: [], channel: "", fits: "", fitModel: "", includeExcluded: false, threshold: undefined } as RecordsSettings,
    over: "stage",
    metric: "lambda",
    trend: "linear",
    bins: 6,
    result: null as TrackingResult | null,
  },
  plan: {
    records: { genotypes: [], channel: "", fits: "", fitModel: "", includeExcluded: false, threshold: undefined } as RecordsSettings,
    effectPercent: 10,
    power: 0.8,
    alpha: 0.05,
    metric: "lambda",
    group: "",
    result: null as PlanResult | null,
  },
};
