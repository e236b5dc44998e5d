import { z } from "zod";

/**
 * How the reaction–diffusion solver steps in time; the single home of its defaults.
 * - `crank-nicolson`: second order in time; its first `startupSteps` steps are
 *   implicit Euler so that a jump in the initial data does not ring
 *   (Rannacher 1984, Numer Math 43:309).
 * - `implicit-euler`: first order, never oscillates.
 * Steps are fixed (`stepS`) or adaptive: each step is taken once whole and once
 * as two halves, and the step size follows the difference between the two
 * (step doubling; Hairer, Nørsett & Wanner 1993, Solving ODEs I, §II.4).
 */
export const SolverSettings = z.strictObject({
  method: z.enum(["crank-nicolson", "implicit-euler"]).default("crank-nicolson"),
  /** Fixed time step (s); adaptive steps when absent. */
  stepS: z.number().positive().nullable().default(null),
  /** Adaptive steps: largest change allowed between one whole step and two half steps, relative to max |c|. */
  tolerance: z.number().positive().max(0.1).default(1e-5),
  /** First step (s) when adaptive; it grows as the solution allows. */
  initialStepS: z.number().positive().default(1e-3),
  /** Implicit Euler steps before Crank–Nicolson takes over. */
  startupSteps: z.number().int().min(0).max(100).default(4),
  /** Refuse runs that would need more steps than this. */
  maxSteps: z.number().int().positive().max(10_000_000).default(200_000),
});
export type SolverSettings = z.output<typeof SolverSettings>;
