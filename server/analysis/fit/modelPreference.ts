import type { AkaikeComparison } from "./akaikeWeights.ts";
import { formatNumber } from "./formatNumber.ts";

/** Which model AICc prefers across the profiles of a group. */
export interface ModelPreference {
  /** The model with the largest summed Akaike weight, or null when no profile could be compared. */
  model: string | null;
  /** Its Akaike weights summed over the compared profiles, and their mean (summed / profilesCompared). */
  summedWeight: number;
  meanWeight: number;
  /** Profiles whose best model by AICc it is. */
  profilesPreferring: number;
  /** Profiles with at least two models compared. */
  profilesCompared: number;
  /** Every candidate's summed weight, largest first. */
  candidates: { model: string; summedWeight: number; profilesPreferring: number }[];
  /** The model that was fitted, and whether AICc prefers it. */
  fittedModel: string;
  agrees: boolean;
  /** A sentence for the user; a warning with what to do when AICc prefers another model. */
  message: string;
}

/**
 * Summarise per-profile AICc comparisons of a group: each candidate's
 * Akaike weights summed over profiles (the evidence for it across the
 * group) and how many profiles it wins. Source: Burnham & Anderson 2002,
 * Model Selection and Multimodel Inference, §2.9 (Akaike weights); summing
 * them over independent data sets is common practice, no source.
 */
export function modelPreference(comparisons: readonly AkaikeComparison[], fittedModel: string): ModelPreference {
  const compared = comparisons.filter((c) => c.ranking.length >= 2);
  const sums = new Map<string, { summedWeight: number; profilesPreferring: number }>();
  for (const c of compared) {
    for (const r of c.ranking) {
      const entry = sums.get(r.model) ?? { summedWeight: 0, profilesPreferring: 0 };
      entry.summedWeight += r.weight;
      if (r.model === c.best) entry.profilesPreferring++;
      sums.set(r.model, entry);
    }
  }
  const candidates = [...sums.entries()].map(([model, v]) => ({ model, ...v })).sort((a, b) => b.summedWeight - a.summedWeight);
  const top = candidates[0];
  if (!top)
    return { model: null, summedWeight: 0, meanWeight: 0, profilesPreferring: 0, profilesCompared: 0, candidates, fittedModel, agrees: true, message: "No profile could be compared across models (too few points or failed fits)" };
  const n = compared.length;
  const agrees = top.model === fittedModel;
  const share = `summed Akaike weight ${formatNumber(top.summedWeight)} over ${n} profile(s), best in ${top.profilesPreferring}`;
  const message = agrees
    ? `AICc prefers the fitted ${fittedModel} model (${share})`
    : `AICc prefers the ${top.model} model, not the fitted ${fittedModel} (${share}); numbers from the fitted model may be biased — refit with --model ${top.model} (or compare with --model all)`;
  return { model: top.model, summedWeight: top.summedWeight, meanWeight: top.summedWeight / n, profilesPreferring: top.profilesPreferring, profilesCompared: n, candidates, fittedModel, agrees, message };
}
