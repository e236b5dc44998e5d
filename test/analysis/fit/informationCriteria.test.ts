import { describe, expect, it } from "vitest";
import { informationCriteria, sumOfLogWeights } from "../../../server/analysis/fit/informationCriteria.ts";

describe("informationCriteria", () => {
  it("matches a hand calculation of AIC, AICc and BIC for n = 10, RSS = 2, three fitted parameters", () => {
    // Source: Hurvich & Tsai 1989, Biometrika (AICc = AIC + 2K(K+1)/(n−K−1)); Burnham & Anderson 2002 §2.2
    // (least-squares log-likelihood, K counts σ²). By hand: K = 4, σ̂² = 0.2,
    // ln L = −5·(ln(2π·0.2) + 1) = −5·(0.2284392 + 1) = −6.1421958,
    // AIC = 8 + 12.2843915 = 20.2843915, AICc = AIC + 40/5 = 28.2843915, BIC = 4·ln 10 + 12.2843915 = 21.4947319
    const c = informationCriteria(2, 10, 3);
    expect(c.k).toBe(4);
    expect(c.logLikelihood!).toBeCloseTo(-6.1421958, 6);
    expect(c.aic!).toBeCloseTo(20.2843915, 6);
    expect(c.aicc!).toBeCloseTo(28.2843915, 6);
    expect(c.bic!).toBeCloseTo(21.4947319, 6);
  });

  it("gives null AICc when n − K − 1 ≤ 0 and null criteria for RSS = 0", () => {
    // Source: the AICc correction term is undefined for n ≤ K + 1 (Hurvich & Tsai 1989).
    expect(informationCriteria(1, 5, 3).aicc).toBeNull();
    expect(informationCriteria(1, 6, 3).aicc).not.toBeNull();
    expect(informationCriteria(0, 10, 2)).toMatchObject({ logLikelihood: null, aic: null, aicc: null, bic: null });
  });

  it("adds ½Σ ln w for known weights", () => {
    // Source: Gaussian likelihood with variances σ²/w_i.
    const unweighted = informationCriteria(3, 20, 2);
    const weighted = informationCriteria(3, 20, 2, sumOfLogWeights([2, 2, 0.5, 4]));
    expect(weighted.logLikelihood! - unweighted.logLikelihood!).toBeCloseTo(0.5 * Math.log(2 * 2 * 0.5 * 4), 12);
  });
});
