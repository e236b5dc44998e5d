import { discretize, type Discretization } from "./discretize.ts";
import type { ReactionDiffusionProblem } from "./reactionDiffusionProblem.ts";
import type { SolverSettings } from "./solverSettings.ts";
import { solveTridiagonal } from "./solveTridiagonal.ts";

export interface SolverRun {
  /** Cell centres (µm; radii on a disc). */
  positionsUm: Float64Array;
  /** The requested output times (s), ascending. */
  timesS: number[];
  /** Cell averages at each output time. */
  profiles: Float64Array[];
  acceptedSteps: number;
  rejectedSteps: number;
}

/** Called after every accepted step with the time (s) and the current cell averages (do not keep the array). */
export type StepObserver = (timeS: number, c: Float64Array) => void;

/**
 * Integrate a 1D (or radially symmetric 2D) reaction–diffusion problem from
 * t = 0 to the last of `outputTimesS`, landing exactly on each output time.
 * θ-method in time (θ = ½ Crank–Nicolson, θ = 1 implicit Euler) on the
 * finite-volume system of {@link discretize}; a nonlinear degradation term is
 * solved by Newton's method in every step (tridiagonal Jacobian).
 * Source: Crank & Nicolson 1947, Proc Camb Phil Soc 43:50; Morton & Mayers
 * 2005, Numerical Solution of PDEs, ch. 2.
 */
export function solveReactionDiffusion(problem: ReactionDiffusionProblem, outputTimesS: readonly number[], settings: SolverSettings, observe?: StepObserver): SolverRun {
  const times = [...outputTimesS].sort((a, b) => a - b);
  if (times.length === 0 || !(times[0] >= 0) || !times.every(Number.isFinite)) throw new RangeError("solveReactionDiffusion: need finite output times ≥ 0");
  const sys = discretize(problem);
  const n = sys.positionsUm.length;
  const stepper = new Stepper(sys);
  let c = problem.initial ? Float64Array.from(problem.initial) : new Float64Array(n);
  if (c.length !== n) throw new RangeError(`solveReactionDiffusion: initial data has ${c.length} values for ${n} cells`);
  const profiles: Float64Array[] = [];
  let t = 0;
  let next = 0;
  while (next < times.length && times[next] <= 0) {
    profiles.push(Float64Array.from(c));
    next++;
  }
  let accepted = 0;
  let rejected = 0;
  let dtTrial = settings.stepS ?? settings.initialStepS;
  const full = new Float64Array(n);
  const half = new Float64Array(n);
  const twoHalves = new Float64Array(n);
  while (next < times.length) {
    if (accepted + rejected >= settings.maxSteps)
      throw new RangeError(`solveReactionDiffusion: more than ${settings.maxSteps} steps needed to reach t = ${times[times.length - 1]} s; use a larger step or tolerance`);
    const target = times[next];
    const remaining = target - t;
    const dt = Math.min(dtTrial, remaining);
    const theta = settings.method === "implicit-euler" || accepted < settings.startupSteps ? 1 : 0.5;
    if (settings.stepS !== null) {
      stepper.step(c, dt, theta, full);
      c.set(full);
    } else {
      stepper.step(c, dt, theta, full);
      stepper.step(c, dt / 2, theta, half);
      stepper.step(half, dt / 2, theta, twoHalves);
      let diff = 0;
      let scale = 0;
      for (let i = 0; i < n; i++) {
        diff = Math.max(diff, Math.abs(full[i] - twoHalves[i]));
        scale = Math.max(scale, Math.abs(twoHalves[i]));
      }
      const err = scale > 0 ? diff / scale : 0;
      // Local error of one step: O(dt³) for Crank–Nicolson, O(dt²) for implicit Euler.
      const power = theta === 0.5 ? 1 / 3 : 1 / 2;
      const factor = err === 0 ? 2 : Math.min(2, Math.max(0.2, 0.9 * (settings.tolerance / err) ** power));
      if (err > settings.tolerance && dt > 1e-12 * Math.max(1, target)) {
        rejected++;
        dtTrial = dt * factor;
        continue;
      }
      c.set(twoHalves);
      if (dt === dtTrial || factor < 1) dtTrial = dt * factor;
    }
    accepted++;
    t = dt === remaining ? target : t + dt;
    observe?.(t, c);
    while (next < times.length && times[next] <= t) {
      profiles.push(Float64Array.from(c));
      next++;
    }
  }
  return { positionsUm: sys.positionsUm, timesS: times, profiles, acceptedSteps: accepted, rejectedSteps: rejected };
}

/** One θ-step, with preallocated work arrays. */
class Stepper {
  private readonly sys: Discretization;
  private readonly lo: Float64Array;
  private readonly di: Float64Array;
  private readonly up: Float64Array;
  private readonly rhs: Float64Array;
  private readonly scratch: Float64Array;
  private readonly delta: Float64Array;
  private readonly jacobianDiagonal: Float64Array;
  private readonly newtonStep: Float64Array;

  constructor(sys: Discretization) {
    this.sys = sys;
    const n = sys.diagonal.length;
    this.lo = new Float64Array(n);
    this.di = new Float64Array(n);
    this.up = new Float64Array(n);
    this.rhs = new Float64Array(n);
    this.scratch = new Float64Array(n);
    this.delta = new Float64Array(n);
    this.jacobianDiagonal = new Float64Array(n);
    this.newtonStep = new Float64Array(n);
  }

  step(c: Float64Array, dt: number, theta: number, out: Float64Array): void {
    const { lower, diagonal, upper, constant, nonlinearK, order } = this.sys;
    const n = c.length;
    // Explicit part: c + (1−θ)·dt·(M c − k·cⁿ) + dt·b.
    const explicit = this.delta;
    for (let i = 0; i < n; i++) {
      let mc = diagonal[i] * c[i] + constant[i];
      if (i > 0) mc += lower[i] * c[i - 1];
      if (i < n - 1) mc += upper[i] * c[i + 1];
      const react = nonlinearK > 0 ? nonlinearK * signedPower(c[i], order) : 0;
      explicit[i] = c[i] + (1 - theta) * dt * (mc - react) + theta * dt * constant[i];
    }
    for (let i = 0; i < n; i++) {
      this.lo[i] = -theta * dt * lower[i];
      this.up[i] = -theta * dt * upper[i];
      this.di[i] = 1 - theta * dt * diagonal[i];
    }
    if (nonlinearK === 0) {
      solveTridiagonal(this.lo, this.di, this.up, explicit, out, this.scratch);
      return;
    }
    // Newton: G(u) = u − θ·dt·(M₀u − k·uⁿ) − explicit = 0, J = (I − θ·dt·M₀) + θ·dt·n·k·|u|ⁿ⁻¹.
    const g = this.rhs;
    const diagJ = this.jacobianDiagonal;
    const step = this.newtonStep;
    out.set(c);
    for (let iter = 0; iter < 30; iter++) {
      let size = 0;
      let scale = 0;
      for (let i = 0; i < n; i++) {
        let lin = this.di[i] * out[i];
        if (i > 0) lin += this.lo[i] * out[i - 1];
        if (i < n - 1) lin += this.up[i] * out[i + 1];
        g[i] = -(lin + theta * dt * nonlinearK * signedPower(out[i], order) - explicit[i]);
        diagJ[i] = this.di[i] + theta * dt * nonlinearK * order * Math.abs(out[i]) ** (order - 1);
      }
      solveTridiagonal(this.lo, diagJ, this.up, g, step, this.scratch);
      for (let i = 0; i < n; i++) {
        out[i] += step[i];
        size = Math.max(size, Math.abs(step[i]));
        scale = Math.max(scale, Math.abs(out[i]));
      }
      if (size <= 1e-13 * Math.max(scale, 1e-300)) return;
    }
    throw new RangeError("solveReactionDiffusion: Newton iteration for the nonlinear degradation did not converge; use smaller steps");
  }
}

/** u·|u|ⁿ⁻¹: the power continued oddly below zero, so tiny negative undershoots stay harmless. */
function signedPower(u: number, n: number): number {
  return u * Math.abs(u) ** (n - 1);
}
