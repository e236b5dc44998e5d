import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { fitProfile, type FitResult, type ProfileFit } from "../../../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { nonFinitePaths, positions, simulateProfile } from "./fitTestData.ts";

function expectFitted(result: FitResult): ProfileFit {
  if (!result.ok) throw new Error(`expected a fit, got ${result.status}: ${result.message}`);
  return result;
}

function relative(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe("fitProfile recovers generating parameters from noise-free profiles to 1e-8", () => {
  // Source: recovery of known parameters from exact synthetic data (common practice, no source).
  const x = positions(0, 400, 201);
  const cases: { model: "exponential" | "finite" | "source" | "power" | "power-free"; theta: number[]; names: string[]; lengthUm?: number; fixed?: Record<string, number> }[] = [
    { model: "exponential", theta: [55], names: ["lambdaUm"] },
    { model: "finite", theta: [140], names: ["lambdaUm"], lengthUm: 400 },
    { model: "finite", theta: [30], names: ["lambdaUm"], lengthUm: 400 },
    { model: "source", theta: [45, 60], names: ["lambdaUm", "sourceWidthUm"] },
    { model: "source", theta: [70, 35], names: ["lambdaUm", "sourceWidthUm"], lengthUm: 400 },
    { model: "source", theta: [45, 60], names: ["lambdaUm", "sourceWidthUm"], fixed: { sourceWidthUm: 60 } },
    { model: "power", theta: [25], names: ["x0Um"] },
    { model: "power-free", theta: [40, 1.4], names: ["x0Um", "exponent"] },
  ];
  for (const c of cases) {
    it(`${c.model}${c.lengthUm ? ` on [0, ${c.lengthUm}]` : ""}${c.fixed ? " with s fixed" : ""}: θ = ${c.theta.join(", ")}`, () => {
      const y = simulateProfile(c.model, x, c.theta, 120, 15, { lengthUm: c.lengthUm });
      const fit = expectFitted(fitProfile(x, y, FitOptions.parse({ model: c.model, fixed: c.fixed }), { lengthUm: c.lengthUm }));
      c.names.forEach((name, j) => expect(relative(fit.parameters[name].value, c.theta[j])).toBeLessThan(1e-8));
      expect(relative(fit.parameters.amplitude.value, 120)).toBeLessThan(1e-8);
      expect(relative(fit.parameters.background.value, 15)).toBeLessThan(1e-8);
      if (c.fixed) expect(fit.parameters.sourceWidthUm).toMatchObject({ value: 60, se: null, ci95: null, fixed: true });
      expect(nonFinitePaths(fit)).toEqual([]);
    });
  }

  it("without a background, and with a fixed background", () => {
    // Source: recovery of known parameters from exact synthetic data (common practice, no source).
    const y = simulateProfile("exponential", x, [35], 50, 0);
    const noBackground = expectFitted(fitProfile(x, y, FitOptions.parse({ background: false })));
    expect(relative(noBackground.parameters.lambdaUm.value, 35)).toBeLessThan(1e-8);
    expect(noBackground.parameters.background).toMatchObject({ value: 0, fixed: true, se: null });
    expect(noBackground.p).toBe(2);
    const y2 = y.map((v) => v + 7);
    const fixedBackground = expectFitted(fitProfile(x, y2, FitOptions.parse({ fixed: { background: 7 } })));
    expect(relative(fixedBackground.parameters.lambdaUm.value, 35)).toBeLessThan(1e-8);
    expect(fixedBackground.parameters.background).toMatchObject({ value: 7, fixed: true });
    expect(Math.abs(fixedBackground.fitted[10] - y2[10])).toBeLessThan(1e-9);
  });
});

describe("fitProfile limits of the finite-domain model", () => {
  it("gives the exponential model's λ (to 1e-6) when L/λ > 15", () => {
    // Source: cosh((L−x)/λ)/cosh(L/λ) → e^(−x/λ) for L ≫ λ (METHODS.md §1); the shapes differ by < e^(−L/λ).
    const random = createRandom(61);
    const x = positions(0, 400, 160);
    const y = simulateProfile("exponential", x, [20], 100, 10, { noiseSd: 1, random });
    const finite = expectFitted(fitProfile(x, y, FitOptions.parse({ model: "finite" }), { lengthUm: 400 }));
    const exponential = expectFitted(fitProfile(x, y, FitOptions.parse({})));
    expect(relative(finite.parameters.lambdaUm.value, exponential.parameters.lambdaUm.value)).toBeLessThan(1e-6);
  });

  it("fits without overflow at L/λ = 1000", () => {
    // Source: cosh(1000) overflows double precision; the overflow-free form of METHODS.md §1 must not.
    const x = positions(0, 5000, 400);
    const y = simulateProfile("finite", x, [5], 100, 10, { lengthUm: 5000 });
    const fit = expectFitted(fitProfile(x, y, FitOptions.parse({ model: "finite" }), { lengthUm: 5000 }));
    expect(relative(fit.parameters.lambdaUm.value, 5)).toBeLessThan(1e-8);
    expect(nonFinitePaths(fit)).toEqual([]);
  });
});

describe("fitProfile results", () => {
  const random = createRandom(20240611);
  const x = positions(0, 300, 120);
  const y = simulateProfile("exponential", x, [48], 90, 11, { noiseSd: 2, random });
  // Unweighted, classic covariance: the textbook definitions checked below.
  const fit = expectFitted(fitProfile(x, y, FitOptions.parse({ weights: "none", errorModel: "classic" })));

  it("fitted + residuals reproduce the data, and rss is their sum of squares", () => {
    // Source: definitions of residual and RSS.
    let rss = 0;
    x.forEach((_, i) => {
      expect(fit.fitted[i] + fit.residuals[i]).toBeCloseTo(y[i], 10);
      rss += fit.residuals[i] ** 2;
    });
    expect(relative(fit.rss, rss)).toBeLessThan(1e-10);
    expect(fit.dof).toBe(117);
    expect(fit.residualSd).toBeCloseTo(Math.sqrt(rss / 117), 10);
  });

  it("r2 = 1 − RSS/TSS", () => {
    // Source: definition of the coefficient of determination.
    const mean = y.reduce((a, b) => a + b, 0) / y.length;
    const tss = y.reduce((a, v) => a + (v - mean) ** 2, 0);
    expect(fit.r2!).toBeCloseTo(1 - fit.rss / tss, 12);
  });

  it("reports a named, symmetric correlation matrix with unit diagonal, consistent with the covariance", () => {
    // Source: definition ρ_ij = Σ_ij/√(Σ_ii Σ_jj).
    const { names, matrix } = fit.correlation!;
    expect(names).toEqual(["lambdaUm", "amplitude", "background"]);
    const cov = fit.covariance!.matrix;
    for (let i = 0; i < 3; i++) {
      expect(matrix[i][i]).toBe(1);
      expect(Math.sqrt(cov[i][i])).toBeCloseTo(fit.parameters[names[i]].se!, 12);
      for (let j = 0; j < 3; j++) {
        expect(matrix[i][j]).toBeCloseTo(matrix[j][i], 14);
        expect(matrix[i][j]).toBeCloseTo(cov[i][j] / Math.sqrt(cov[i][i] * cov[j][j]), 12);
      }
    }
  });

  it("95% intervals are value ± t(0.975, n − p)·se, on the log scale for λ (value·exp(±t·se/value))", () => {
    // Source: t quantile t(0.975, 117) = 1.980448 (scipy.stats.t.ppf, value from memory to 6 digits);
    // log-scale interval with SE(log λ) = se/λ by the delta method (science.md §8, bounded parameters).
    const { value, se, ci95, ciScale } = fit.parameters.lambdaUm;
    expect(ciScale).toBe("log");
    expect((Math.log(ci95![1] / value) * value) / se!).toBeCloseTo(1.980448, 5);
    expect((Math.log(value / ci95![0]) * value) / se!).toBeCloseTo(1.980448, 5);
    const amplitude = fit.parameters.amplitude;
    expect((amplitude.ci95![1] - amplitude.value) / amplitude.se!).toBeCloseTo(1.980448, 5);
    expect((amplitude.value - amplitude.ci95![0]) / amplitude.se!).toBeCloseTo(1.980448, 5);
  });

  it("reports D/k = λ² with the delta-method se 2λ·se(λ)", () => {
    // Source: λ = √(D/k) (METHODS.md §1); delta method.
    const lambda = fit.parameters.lambdaUm;
    expect(fit.derived.diffusionOverDegradationUm2.value).toBeCloseTo(lambda.value ** 2, 9);
    expect(fit.derived.diffusionOverDegradationUm2.se!).toBeCloseTo(2 * lambda.value * lambda.se!, 9);
  });

  it("uses only points inside the window, and says how many", () => {
    // common practice, no source
    const windowed = expectFitted(fitProfile(x, y, FitOptions.parse({ window: { xMinUm: 20, xMaxUm: 200 } })));
    const inside = x.filter((v) => v >= 20 && v <= 200);
    expect(windowed.n).toBe(inside.length);
    expect(windowed.xUm).toEqual(inside);
  });

  it("skips missing values with a warning and sorts unsorted input", () => {
    // common practice, no source
    const order = x.map((_, i) => i).reverse();
    const xs = order.map((i) => x[i]);
    const ys = order.map((i) => y[i]);
    ys[5] = NaN;
    xs[9] = Infinity;
    const fit2 = expectFitted(fitProfile(xs, ys, FitOptions.parse({})));
    expect(fit2.n).toBe(x.length - 2);
    expect(fit2.warnings.join(" ")).toMatch(/2 point\(s\) skipped/);
    expect(fit2.xUm[0]).toBe(0);
    expect(relative(fit2.parameters.lambdaUm.value, fit.parameters.lambdaUm.value)).toBeLessThan(0.05);
  });
});

describe("fitProfile edge cases return clear statuses and no NaN", () => {
  it("fits exactly 5 points (n − p = 2 degrees of freedom)", () => {
    // common practice, no source
    const x = [0, 20, 40, 60, 80];
    const y = simulateProfile("exponential", x, [30], 100, 10).map((v, i) => v + [0.3, -0.2, 0.1, -0.4, 0.2][i]);
    const fit = expectFitted(fitProfile(x, y, FitOptions.parse({})));
    expect(fit.n).toBe(5);
    expect(fit.dof).toBe(2);
    expect(fit.aicc).toBeNull();
    expect(fit.warnings.join(" ")).toMatch(/not tested against a flat line/);
    expect(nonFinitePaths(fit)).toEqual([]);
  });

  it("a constant profile is 'no-decay'", () => {
    // Source: fact of the trade, a flat profile has no decay length.
    const result = fitProfile(positions(0, 100, 30), new Array(30).fill(42), FitOptions.parse({}));
    expect(result).toMatchObject({ ok: false, status: "no-decay" });
    expect(result.message).toMatch(/all 30 intensities are equal/);
    expect(nonFinitePaths(result)).toEqual([]);
  });

  it("a rising profile is 'no-decay', for every model", () => {
    // Source: fact of the trade, intensity must fall away from the source.
    const x = positions(0, 200, 60);
    const y = x.map((v) => 10 + 50 * (1 - Math.exp(-v / 40)));
    for (const model of ["exponential", "finite", "power", "power-free", "source"] as const) {
      const result = fitProfile(x, y, FitOptions.parse({ model }), { lengthUm: 200 });
      expect(result.status).toBe("no-decay");
      expect(nonFinitePaths(result)).toEqual([]);
    }
  });

  it("a linearly falling profile is 'no-decay' rather than λ = 1e12", () => {
    // common practice, no source: λ ≫ window makes an exponential indistinguishable from a line.
    const x = positions(0, 100, 40);
    const result = fitProfile(x, x.map((v) => 100 - 0.5 * v), FitOptions.parse({}));
    expect(result.status).toBe("no-decay");
    expect(result.message).toMatch(/upper limit|flat line/);
  });

  it("a noisy flat profile is 'no-decay' because a flat line fits as well (AICc)", () => {
    // Source: AICc comparison with a constant model (Hurvich & Tsai 1989, Biometrika).
    const random = createRandom(7);
    const x = positions(0, 200, 80);
    const result = fitProfile(x, x.map(() => 50 + random.normal()), FitOptions.parse({}));
    expect(result.status).toBe("no-decay");
    expect(nonFinitePaths(result)).toEqual([]);
  });

  it("too few points for the parameters gives 'too-few-points' with the counts", () => {
    // common practice, no source
    const result = fitProfile([0, 10, 20], [9, 5, 3], FitOptions.parse({}));
    expect(result).toMatchObject({ ok: false, status: "too-few-points", n: 3, p: 3 });
    expect(result.message).toMatch(/3 point\(s\) to fit, but the exponential model has 3 free parameters and needs at least 4/);
    expect(fitProfile([], [], FitOptions.parse({})).status).toBe("too-few-points");
  });

  it("the finite model without L, or with positions beyond L, is 'invalid-input'", () => {
    // common practice, no source
    const x = positions(0, 100, 20);
    const y = simulateProfile("exponential", x, [20], 10, 1);
    expect(fitProfile(x, y, FitOptions.parse({ model: "finite" })).message).toMatch(/needs the embryo length L/);
    expect(fitProfile(x, y, FitOptions.parse({ model: "finite" }), { lengthUm: 80 })).toMatchObject({ status: "invalid-input" });
  });

  it("inverse-variance weights without a variance array is 'invalid-input'", () => {
    // common practice, no source
    const result = fitProfile([0, 1, 2, 3, 4], [5, 4, 3, 2.5, 2], FitOptions.parse({ weights: "inverse-variance" }));
    expect(result).toMatchObject({ ok: false, status: "invalid-input" });
    expect(result.message).toMatch(/need a variance/);
  });

  it("mismatched x and y lengths are a programmer error and throw", () => {
    // common practice, no source
    expect(() => fitProfile([0, 1, 2], [1, 2], FitOptions.parse({}))).toThrow(/x has 3 values but y has 2/);
  });

  it("a fixed value for a parameter the model lacks is ignored with a warning", () => {
    // common practice, no source
    const x = positions(0, 100, 30);
    const fit = expectFitted(fitProfile(x, simulateProfile("exponential", x, [20], 10, 1), FitOptions.parse({ fixed: { x0Um: 3 } })));
    expect(fit.warnings).toContain("fixed.x0Um is ignored: the exponential model has no such parameter");
  });
});
