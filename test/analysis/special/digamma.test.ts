import { describe, expect, it } from "vitest";
import { digamma } from "../../../server/analysis/special/digamma.ts";
import { logSdBias } from "../../../server/analysis/precision/regionSigma.ts";
import { runPython } from "../../helpers/python.ts";

describe("digamma", () => {
  it("matches scipy.special.digamma to 1e-11 relative from 0.05 to 500", async () => {
    const xs = [0.05, 0.5, 1, 1.5, 2.5, 3.5, 5.9, 6, 14.5, 99.5, 500];
    // Source: scipy.special.digamma as reference.
    const ref = await runPython<number[]>("from scipy import special\nresult = [float(special.digamma(x)) for x in data]", xs);
    xs.forEach((x, i) => expect(Math.abs(digamma(x) - ref[i])).toBeLessThan(1e-11 * Math.max(1, Math.abs(ref[i]))));
    // Source: ψ(1) = −γ (Euler–Mascheroni constant), Abramowitz & Stegun 1964, 6.3.2.
    expect(digamma(1)).toBeCloseTo(-0.5772156649015329, 13);
    expect(() => digamma(0)).toThrow(/x must be > 0/);
  });

  it("logSdBias equals the mean of ln(s/σ) over seeded normal samples (numpy), e.g. about −0.017 at 30 values", async () => {
    // Source: numpy as reference: E[ln s] − ln σ for the SD of n normal values, by simulation.
    const ns = [5, 8, 30];
    const ref = await runPython<number[]>(
      "rng = np.random.default_rng(7)\nresult = [float(np.mean(np.log(rng.standard_normal((400000, n)).std(axis=1, ddof=1)))) for n in data]",
      ns,
    );
    ns.forEach((n, i) => expect(Math.abs(logSdBias(n) - ref[i])).toBeLessThan(1e-3));
  });
});
