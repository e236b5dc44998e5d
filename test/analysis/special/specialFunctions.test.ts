import { describe, expect, it } from "vitest";
import { logGamma } from "../../../server/analysis/special/logGamma.ts";
import { incompleteBeta } from "../../../server/analysis/special/incompleteBeta.ts";
import { erf, erfc, erfcx } from "../../../server/analysis/special/errorFunction.ts";
import { normalCdf, normalQuantile } from "../../../server/analysis/stats/normal.ts";
import { studentTCdf, studentTQuantile, studentTTwoSidedP } from "../../../server/analysis/stats/studentT.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

// Source: scipy.special and scipy.stats as the outside reference on identical inputs.
const reference = await runPython<{
  lgamma: number[]; betainc: number[]; erf: number[]; erfc: number[]; erfcx: number[];
  ncdf: number[]; nppf: number[]; tcdf: number[]; tppf: number[]; tsf2: number[];
}>(
  `
from scipy import special, stats
result = {
  "lgamma": [float(special.gammaln(x)) for x in data["gx"]],
  "betainc": [float(special.betainc(a, b, x)) for (x, a, b) in data["beta"]],
  "erf": [float(special.erf(x)) for x in data["ex"]],
  "erfc": [float(special.erfc(x)) for x in data["ex"]],
  "erfcx": [float(special.erfcx(x)) for x in data["ex"]],
  "ncdf": [float(stats.norm.cdf(x)) for x in data["nx"]],
  "nppf": [float(stats.norm.ppf(p)) for p in data["p"]],
  "tcdf": [float(stats.t.cdf(t, df)) for (t, df) in data["t"]],
  "tppf": [float(stats.t.ppf(p, df)) for (p, df) in data["tq"]],
  "tsf2": [float(2 * stats.t.sf(abs(t), df)) for (t, df) in data["t"]],
}
`,
  {
    gx: [0.1, 0.5, 1, 1.5, 2.5, 7.3, 30, 171.2],
    beta: [[0.3, 2, 3], [0.9, 0.5, 0.5], [0.01, 10, 0.5], [0.999, 4.5, 0.5], [0.5, 50, 50]],
    ex: [-3, -0.5, 0, 0.2, 1, 2.5, 4.9, 6, 12, 30],
    nx: [-8, -2, -0.3, 0, 1.96, 5],
    p: [1e-10, 0.001, 0.025, 0.3, 0.5, 0.8, 0.975, 0.999999],
    t: [[-3, 2], [0.5, 4.5], [2.1, 10], [12, 3.3], [-0.2, 120]],
    tq: [[0.975, 1], [0.975, 2.7], [0.975, 10], [0.025, 30], [0.995, 5.5], [0.6, 200]],
  },
);

describe("special functions against scipy.special", () => {
  it("logGamma matches scipy.special.gammaln to 1e-13 relative", () => {
    [0.1, 0.5, 1, 1.5, 2.5, 7.3, 30, 171.2].forEach((x, i) => {
      expect(Math.abs(logGamma(x) - reference.lgamma[i])).toBeLessThan(1e-13 * Math.max(1, Math.abs(reference.lgamma[i])));
    });
  });
  it("incompleteBeta matches scipy.special.betainc to 1e-12", () => {
    const cases: [number, number, number][] = [[0.3, 2, 3], [0.9, 0.5, 0.5], [0.01, 10, 0.5], [0.999, 4.5, 0.5], [0.5, 50, 50]];
    cases.forEach(([x, a, b], i) => expect(Math.abs(incompleteBeta(x, a, b) - reference.betainc[i])).toBeLessThan(1e-12));
  });
  it("erf, erfc and erfcx match scipy.special to 1e-12 relative", () => {
    [-3, -0.5, 0, 0.2, 1, 2.5, 4.9, 6, 12, 30].forEach((x, i) => {
      expect(Math.abs(erf(x) - reference.erf[i])).toBeLessThan(1e-14);
      if (reference.erfc[i] > 0) expect(relativeDifference(erfc(x), reference.erfc[i])).toBeLessThan(1e-12);
      expect(relativeDifference(erfcx(x), reference.erfcx[i])).toBeLessThan(1e-12);
    });
  });
});

describe("distributions against scipy.stats", () => {
  it("normalCdf and normalQuantile match scipy.stats.norm to 1e-12", () => {
    [-8, -2, -0.3, 0, 1.96, 5].forEach((x, i) => expect(relativeDifference(normalCdf(x), reference.ncdf[i])).toBeLessThan(1e-12));
    [1e-10, 0.001, 0.025, 0.3, 0.5, 0.8, 0.975, 0.999999].forEach((p, i) =>
      expect(Math.abs(normalQuantile(p) - reference.nppf[i])).toBeLessThan(1e-10 * Math.max(1, Math.abs(reference.nppf[i]))),
    );
  });
  it("studentTCdf, studentTTwoSidedP and studentTQuantile match scipy.stats.t (fractional df included)", () => {
    const t: [number, number][] = [[-3, 2], [0.5, 4.5], [2.1, 10], [12, 3.3], [-0.2, 120]];
    t.forEach(([x, df], i) => {
      expect(relativeDifference(studentTCdf(x, df), reference.tcdf[i])).toBeLessThan(1e-11);
      expect(relativeDifference(studentTTwoSidedP(x, df), reference.tsf2[i])).toBeLessThan(1e-11);
    });
    const q: [number, number][] = [[0.975, 1], [0.975, 2.7], [0.975, 10], [0.025, 30], [0.995, 5.5], [0.6, 200]];
    q.forEach(([p, df], i) => expect(relativeDifference(studentTQuantile(p, df), reference.tppf[i])).toBeLessThan(1e-10));
  });
  it("studentTQuantile gives the textbook 95% value for 10 degrees of freedom", () => {
    // Source: standard t table, t_{0.975, 10} = 2.228 (value from memory, 4 significant figures).
    expect(studentTQuantile(0.975, 10)).toBeCloseTo(2.228, 3);
  });
});
