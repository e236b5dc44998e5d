import { describe, expect, it } from "vitest";
import { solveReactionDiffusion } from "../../../server/analysis/dynamics/solver/solveReactionDiffusion.ts";
import { steadyState } from "../../../server/analysis/dynamics/solver/steadyState.ts";
import { accumulationTimes } from "../../../server/analysis/dynamics/solver/accumulationTimes.ts";
import { SolverSettings } from "../../../server/analysis/dynamics/solver/solverSettings.ts";
import type { ReactionDiffusionProblem } from "../../../server/analysis/dynamics/solver/reactionDiffusionProblem.ts";
import { accumulationTime } from "../../../server/analysis/dynamics/buildUp/accumulationTime.ts";

const problem = (over: Partial<ReactionDiffusionProblem>): ReactionDiffusionProblem => ({
  geometry: "line",
  lengthUm: 60,
  cells: 240,
  diffusionUm2PerS: 0.4,
  degradationPerS: 0.01,
  degradationOrder: 1,
  source: null,
  left: { kind: "flux", influx: 1.5 },
  right: { kind: "flux", influx: 0 },
  initial: null,
  ...over,
});
const relMax = (c: Float64Array, x: Float64Array, f: (x: number) => number) => {
  let peak = 0;
  let err = 0;
  for (let i = 0; i < c.length; i++) {
    peak = Math.max(peak, Math.abs(f(x[i])));
    err = Math.max(err, Math.abs(c[i] - f(x[i])));
  }
  return err / peak;
};

describe("solver steady states against the closed forms", () => {
  const d = 0.4;
  const k = 0.01;
  const lambda = Math.sqrt(d / k); // 6.32 µm
  const j0 = 1.5;

  it("finite domain with influx and a closed far end: c = (j0λ/D)·cosh((L−x)/λ)/sinh(L/λ), by running the clock and directly", () => {
    // Source: science notes §1, finite [0, L] with influx at 0 and no flux at L [derived, standard SDD].
    const lengthUm = 15;
    const p = problem({ lengthUm, cells: 300 });
    const exact = (x: number) => ((j0 * lambda) / d) * (Math.cosh((lengthUm - x) / lambda) / Math.sinh(lengthUm / lambda));
    const run = solveReactionDiffusion(p, [3000], SolverSettings.parse({ tolerance: 1e-7 }));
    expect(relMax(run.profiles[0], run.positionsUm, exact)).toBeLessThan(1e-4);
    expect(relMax(steadyState(p), run.positionsUm, exact)).toBeLessThan(1e-4);
  });

  it("localized source with a closed end at 0: (ν/k)[1 − e^(−s/λ)cosh(x/λ)] inside, (ν/k)sinh(s/λ)e^(−x/λ) outside", () => {
    // Source: science notes §1, localized source on a semi-infinite line [derived]; L = 60 µm ≈ 9.5λ stands in for ∞.
    const nu = 0.02;
    const s = 5;
    const p = problem({ cells: 600, left: { kind: "flux", influx: 0 }, source: { fromUm: 0, toUm: s, ratePerS: nu } });
    const exact = (x: number) => (x < s ? (nu / k) * (1 - Math.exp(-s / lambda) * Math.cosh(x / lambda)) : (nu / k) * Math.sinh(s / lambda) * Math.exp(-x / lambda));
    const c = steadyState(p);
    const x = new Float64Array(600).map((_, i) => (i + 0.5) * 0.1);
    // Far-end error e^(−2L/λ) ≈ 6e-9, grid error O(h²).
    expect(relMax(c.subarray(0, 300), x.subarray(0, 300), exact)).toBeLessThan(1e-4);
  });

  it("localized source on a finite domain: (ν/k)·sinh(s/λ)·cosh((L−x)/λ)/sinh(L/λ) beyond the source", () => {
    // Source: science notes §1, localized source on finite [0, L] [derived].
    const nu = 0.02;
    const s = 4;
    const lengthUm = 20;
    const p = problem({ lengthUm, cells: 400, left: { kind: "flux", influx: 0 }, source: { fromUm: 0, toUm: s, ratePerS: nu } });
    const exact = (x: number) =>
      x < s
        ? (nu / k) * (1 - (Math.sinh((lengthUm - s) / lambda) * Math.cosh(x / lambda)) / Math.sinh(lengthUm / lambda))
        : (nu / k) * (Math.sinh(s / lambda) * Math.cosh((lengthUm - x) / lambda)) / Math.sinh(lengthUm / lambda);
    const run = solveReactionDiffusion(p, [4000], SolverSettings.parse({ tolerance: 1e-7 }));
    const x = run.positionsUm;
    expect(relMax(run.profiles[0], x, exact)).toBeLessThan(1e-4);
    // Mass balance: k∫c dx = ν·s (every molecule made is degraded).
    const total = run.profiles[0].reduce((a, v) => a + v * (lengthUm / 400), 0);
    expect(k * total).toBeCloseTo(nu * s, 6);
  });

  it("nonlinear degradation n = 2 reaches the power law c = 6D/(k(x+ε)²), ε³ = 12D²/(k·j0)", () => {
    // Source: Eldar, Rosin, Shilo & Barkai 2003, Dev Cell 5:635 (power-law steady state); ε from the influx condition (science notes §1).
    const k2 = 0.05;
    const eps = Math.cbrt((12 * d * d) / (k2 * j0));
    const exact = (x: number) => (6 * d) / (k2 * (x + eps) ** 2);
    const lengthUm = 40;
    // The far end is held at the exact value, so the power law is the steady state on [0, L].
    const p = problem({ lengthUm, cells: 800, degradationPerS: k2, degradationOrder: 2, right: { kind: "fixed", value: exact(lengthUm) } });
    const run = solveReactionDiffusion(p, [20_000], SolverSettings.parse({ tolerance: 1e-6 }));
    expect(relMax(run.profiles[0], run.positionsUm, exact)).toBeLessThan(1e-3);
  });

  it("fixed concentration at 0 gives c0·e^(−x/λ)", () => {
    // Source: textbook SDD steady state with c(0) = c0 on a semi-infinite line.
    const p = problem({ cells: 600, left: { kind: "fixed", value: 3 } });
    const c = steadyState(p);
    const x = new Float64Array(600).map((_, i) => (i + 0.5) * 0.1);
    expect(relMax(c.subarray(0, 300), x.subarray(0, 300), (v) => 3 * Math.exp(-v / lambda))).toBeLessThan(1e-4);
  });
});

describe("accumulationTimes", () => {
  it("τ(x) = ∫(1 − c/c_s)dt from the solver matches (1 + x/λ)/(2k) within 0.5%", () => {
    // Source: Berezhkovskii, Sample & Shvartsman 2010, Biophys J 99:L59, eq. for the influx boundary.
    const d = 0.3;
    const k = 2e-3;
    const lambda = Math.sqrt(d / k); // 12.2 µm
    const p = problem({ lengthUm: 20 * lambda, cells: 800, diffusionUm2PerS: d, degradationPerS: k, left: { kind: "flux", influx: 1 } });
    const tau = accumulationTimes(p, SolverSettings.parse({ tolerance: 1e-6 }));
    for (const xUm of [0.5 * lambda, lambda, 2 * lambda, 4 * lambda]) {
      const i = Math.round(xUm / (p.lengthUm / 800) - 0.5);
      const x = tau.positionsUm[i];
      expect(Math.abs(tau.timesS[i] / accumulationTime(x, d, k) - 1)).toBeLessThan(0.005);
    }
  });
});
