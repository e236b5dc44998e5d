export interface InformationCriteria {
  /** Maximised Gaussian log-likelihood, or null when RSS is 0 (a perfect fit has no finite likelihood). */
  logLikelihood: number | null;
  aic: number | null;
  /** Small-sample AIC, or null when n − K − 1 ≤ 0. */
  aicc: number | null;
  bic: number | null;
  /** Parameters counted, K = fitted parameters + 1 for the noise variance. */
  k: number;
}

/**
 * Information criteria of a least-squares fit with Gaussian errors.
 * Log-likelihood at the MLE σ̂² = RSS/n, with known relative weights w_i:
 *   ln L = ½Σ ln w_i − (n/2)(ln(2π·RSS/n) + 1)
 * AIC = 2K − 2 ln L, AICc = AIC + 2K(K+1)/(n − K − 1), BIC = K ln n − 2 ln L,
 * with K counting the noise variance as a parameter.
 * Sources: Hurvich & Tsai 1989, Biometrika (AICc); Burnham & Anderson 2002,
 * Model Selection and Multimodel Inference, §2.2–2.4 (least-squares form,
 * K includes σ²); Schwarz 1978, Ann Stat (BIC).
 */
export function informationCriteria(rss: number, n: number, fittedParameters: number, sumLogWeights = 0): InformationCriteria {
  const k = fittedParameters + 1;
  if (!(rss > 0) || !Number.isFinite(rss) || !(n > 0)) return { logLikelihood: null, aic: null, aicc: null, bic: null, k };
  const logLikelihood = 0.5 * sumLogWeights - (n / 2) * (Math.log((2 * Math.PI * rss) / n) + 1);
  const aic = 2 * k - 2 * logLikelihood;
  const aicc = n - k - 1 > 0 ? aic + (2 * k * (k + 1)) / (n - k - 1) : null;
  const bic = k * Math.log(n) - 2 * logLikelihood;
  return { logLikelihood, aic, aicc, bic, k };
}

/** Σ ln w_i, the weights' term of the Gaussian log-likelihood (0 for unit weights). */
export function sumOfLogWeights(weights: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < weights.length; i++) s += Math.log(weights[i]);
  return s;
}
