import { describe, expect, it } from "vitest";
import { solveReactionDiffusion } from "../../../server/analysis/dynamics/solver/solveReactionDiffusion.ts";
import { SolverSettings } from "../../../server/analysis/dynamics/solver/solverSettings.ts";
import type { ReactionDiffusionProblem } from "../../../server/analysis/dynamics/solver/reactionDiffusionProblem.ts";
import { influxBuildUp } from "../../../server/analysis/dynamics/buildUp/influxBuildUp.ts";
import { erfc } from "../../../server/analysis/special/errorFunction.ts";

const base = (over: Partial<ReactionDiffusionProblem>): ReactionDiffusionProblem => ({
  geometry: "line",
  lengthUm: 100,
  cells: 100,
  diffusionUm2PerS: 1,
  degradationPerS: 0,
  degradationOrder: 1,
  source: null,
  left: { kind: "flux", influx: 0 },
  right: { kind: "flux", influx: 0 },
  initial: null,
  ...over,
});
const fixedStep = (stepS: number, method: "crank-nicolson" | "implicit-euler" = "crank-nicolson") => SolverSettings.parse({ stepS, method });
const maxAbs = (f: (i: number) => number, n: number) => {
  let m = 0;
  for (let i = 0; i < n; i++) m = Math.max(m, Math.abs(f(i)));
  return m;
};
/** Observed order of convergence from errors on grids refined by 2. */
const order = (errors: number[]) => errors.slice(1).map((e, i) => Math.log2(errors[i] / e));

describe("solveReactionDiffusion: pure diffusion", () => {
  it("spreads a point source as a Gaussian whose variance grows by exactly 2Dt", () => {
    // Source: textbook diffusion (heat kernel, variance 2Dt); value from memory.
    const cells = 201;
    const h = 100 / cells;
    const initial = new Float64Array(cells);
    initial[100] = 1 / h;
    const run = solveReactionDiffusion(base({ cells, initial, diffusionUm2PerS: 0.5 }), [40], fixedStep(0.5));
    const c = run.profiles[0];
    let mass = 0;
    let mean = 0;
    let second = 0;
    for (let i = 0; i < cells; i++) {
      mass += c[i] * h;
      mean += c[i] * h * run.positionsUm[i];
    }
    mean /= mass;
    for (let i = 0; i < cells; i++) second += c[i] * h * (run.positionsUm[i] - mean) ** 2;
    expect(mass).toBeCloseTo(1, 12);
    expect(mean).toBeCloseTo(50, 10);
    // The point mass sits at one cell centre (variance 0); the discrete second moment then grows by exactly 2Dt.
    expect(second / mass).toBeCloseTo(2 * 0.5 * 40, 8);
  });

  it("converges to the Gaussian at second order in space and time (errors shrink ~4× per halving)", () => {
    // Source: heat kernel, variance 2D(t0 + t) (textbook); Crank–Nicolson is second order (Crank & Nicolson 1947).
    const d = 1;
    const t0 = 5;
    const t = 10;
    const gauss = (x: number, s: number) => Math.exp(-((x - 50) ** 2) / (4 * d * s)) / Math.sqrt(4 * Math.PI * d * s);
    const errors = [50, 100, 200].map((cells) => {
      const h = 100 / cells;
      // Cell averages of the initial Gaussian (Simpson's rule on each cell).
      const initial = new Float64Array(cells).map((_, i) => {
        const a = i * h;
        return (gauss(a, t0) + 4 * gauss(a + h / 2, t0) + gauss(a + h, t0)) / 6;
      });
      const run = solveReactionDiffusion(base({ cells, initial }), [t], fixedStep(0.4 * h, "crank-nicolson"));
      return maxAbs((i) => run.profiles[0][i] - gauss(run.positionsUm[i], t0 + t), cells);
    });
    for (const p of order(errors)) expect(p).toBeGreaterThan(1.8);
    for (const p of order(errors)) expect(p).toBeLessThan(2.3);
  });

  it("relaxes a step to ½·erfc at short times and to ½ everywhere at long times, without ringing", () => {
    // Source: textbook step solution ½·erfc(x/√(4Dt)) (science notes §2); conservation gives ½ at t → ∞.
    const cells = 400;
    const initial = new Float64Array(cells).map((_, i) => (i < cells / 2 ? 1 : 0));
    const run = solveReactionDiffusion(base({ cells, initial }), [20, 20_000], SolverSettings.parse({ stepS: 1 }));
    const short = run.profiles[0];
    const err = maxAbs((i) => short[i] - 0.5 * erfc((run.positionsUm[i] - 50) / Math.sqrt(4 * 20)), cells);
    expect(err).toBeLessThan(2e-3);
    for (const v of short) expect(v).toBeGreaterThanOrEqual(-1e-6);
    for (const v of short) expect(v).toBeLessThanOrEqual(1 + 1e-6);
    for (const v of run.profiles[1]) expect(v).toBeCloseTo(0.5, 6);
  });

  it("without the implicit start-up steps, Crank–Nicolson rings on the step (the reason for the start-up)", () => {
    // Source: Rannacher 1984, Numer Math 43:309 — CN with large steps preserves high-frequency error.
    const cells = 400;
    const initial = new Float64Array(cells).map((_, i) => (i < cells / 2 ? 1 : 0));
    const ring = solveReactionDiffusion(base({ cells, initial }), [20], SolverSettings.parse({ stepS: 2, startupSteps: 0 }));
    const smooth = solveReactionDiffusion(base({ cells, initial }), [20], SolverSettings.parse({ stepS: 2, startupSteps: 4 }));
    // A monotone profile from 1 to 0 has total variation 1; ringing adds to it.
    const excessVariation = (c: Float64Array) => c.slice(1).reduce((s, v, i) => s + Math.abs(v - c[i]), 0) - 1;
    expect(excessVariation(ring.profiles[0])).toBeGreaterThan(1e-2);
    expect(excessVariation(smooth.profiles[0])).toBeLessThan(1e-6);
  });
});

describe("solveReactionDiffusion: SDD build-up", () => {
  const d = 0.5;
  const k = 0.01;
  const j0 = 2;
  const lengthUm = 200; // ≥ 28λ: the far end is invisible at these times

  it("matches the pre-steady-state erfc solution and converges at second order", () => {
    // Source: closed form of METHODS.md (Dynamics), c = (j0λ/2D)[e^(−x/λ)erfc(z−) − e^(x/λ)erfc(z+)].
    const tEnd = 60;
    const errors = [100, 200, 400].map((cells) => {
      const h = lengthUm / cells;
      const run = solveReactionDiffusion(base({ cells, lengthUm, diffusionUm2PerS: d, degradationPerS: k, left: { kind: "flux", influx: j0 } }), [tEnd], SolverSettings.parse({ stepS: h / 2, startupSteps: 2 }));
      return maxAbs((i) => run.profiles[0][i] - influxBuildUp(run.positionsUm[i], tEnd, d, k, j0), cells);
    });
    expect(errors[2] / influxBuildUp(0, tEnd, d, k, j0)).toBeLessThan(2e-4);
    for (const p of order(errors)) expect(p).toBeGreaterThan(1.8);
    for (const p of order(errors)) expect(p).toBeLessThan(2.3);
  });

  it("adaptive steps meet the erfc solution at every output time", () => {
    // Source: as above.
    const times = [1, 10, 100, 400];
    const run = solveReactionDiffusion(base({ cells: 400, lengthUm, diffusionUm2PerS: d, degradationPerS: k, left: { kind: "flux", influx: j0 } }), times, SolverSettings.parse({ tolerance: 1e-6 }));
    times.forEach((t, m) => {
      const peak = influxBuildUp(0, t, d, k, j0);
      // At t = 1 s the diffusion length √(4Dt) spans under three cells, so the spatial error dominates.
      expect(maxAbs((i) => run.profiles[m][i] - influxBuildUp(run.positionsUm[i], t, d, k, j0), 400) / peak).toBeLessThan(t < 5 ? 2e-2 : 2e-3);
    });
    expect(run.rejectedSteps).toBeLessThan(run.acceptedSteps);
  });

  it("implicit Euler converges at first order in time", () => {
    // Source: Morton & Mayers 2005, Numerical Solution of PDEs, §2.10 (backward Euler is first order in time).
    const cells = 800;
    const tEnd = 30;
    const errors = [1, 0.5, 0.25].map((stepS) => {
      const run = solveReactionDiffusion(base({ cells, lengthUm, diffusionUm2PerS: d, degradationPerS: k, left: { kind: "flux", influx: j0 } }), [tEnd], fixedStep(stepS, "implicit-euler"));
      return maxAbs((i) => run.profiles[0][i] - influxBuildUp(run.positionsUm[i], tEnd, d, k, j0), cells);
    });
    for (const p of order(errors)) expect(p).toBeGreaterThan(0.85);
    for (const p of order(errors)) expect(p).toBeLessThan(1.2);
  });
});
