import { formatNumber } from "./formatNumber.ts";

export interface RankedModel {
  model: string;
  aicc: number;
  /** AICc − smallest AICc among the candidates. */
  deltaAicc: number;
  /** Akaike weight: the relative support for this model among the candidates. */
  weight: number;
}

export interface AkaikeComparison {
  /** Candidates from best (smallest AICc) to worst. */
  ranking: RankedModel[];
  best: string | null;
  /** The two best models are within ΔAICc < 2 of each other. */
  indistinguishable: boolean;
  message: string;
}

/**
 * ΔAICc and Akaike weights w_i = exp(−Δ_i/2)/Σ_j exp(−Δ_j/2) for models
 * fitted to the same data. Models within ΔAICc < 2 of the best have
 * substantial support, so the best two are then flagged indistinguishable.
 * Source: Burnham & Anderson 2002, Model Selection and Multimodel Inference,
 * §2.6 (ΔAIC rules of thumb) and §2.9 (Akaike weights).
 */
export function akaikeWeights(candidates: readonly { model: string; aicc: number }[]): AkaikeComparison {
  const usable = candidates.filter((c) => Number.isFinite(c.aicc));
  if (usable.length === 0) return { ranking: [], best: null, indistinguishable: false, message: "No model could be compared (no fit produced an AICc)" };
  const sorted = [...usable].sort((a, b) => a.aicc - b.aicc);
  const minimum = sorted[0].aicc;
  const relative = sorted.map((c) => Math.exp(-0.5 * (c.aicc - minimum)));
  const total = relative.reduce((a, b) => a + b, 0);
  const ranking = sorted.map((c, i) => ({ model: c.model, aicc: c.aicc, deltaAicc: c.aicc - minimum, weight: relative[i] / total }));
  const best = ranking[0].model;
  if (ranking.length === 1)
    return { ranking, best, indistinguishable: false, message: `Only ${best} could be fitted; nothing to compare it with` };
  const second = ranking[1];
  const indistinguishable = second.deltaAicc < 2;
  const message = indistinguishable
    ? `${best} and ${second.model} are indistinguishable on these data (ΔAICc = ${formatNumber(second.deltaAicc)} < 2); do not choose between them from this fit`
    : `${best} is preferred (Akaike weight ${formatNumber(ranking[0].weight)}; next best ${second.model} at ΔAICc = ${formatNumber(second.deltaAicc)})`;
  return { ranking, best, indistinguishable, message };
}
