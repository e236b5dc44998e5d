import type { SteadyStateModel } from "../models/steadyStateModel.ts";
import type { SeparableBlock } from "./separableBlock.ts";

/**
 * The reduced (variable-projection) least-squares problem over the free
 * nonlinear parameters, shared by one or more blocks (profiles): each block
 * solves its own amplitude and background, and the blocks' residual sums of
 * squares, Kaufman Gram matrices JᵀJ and gradients Jᵀr add up. Because the
 * linear part is block-diagonal, a global fit over many embryos costs the
 * same per point as a single fit. Source: Golub & Pereyra 1973, SIAM J Numer
 * Anal (variable projection); Kaufman 1975, BIT (Jacobian approximation).
 */
export class ProjectedProblem {
  readonly model: SteadyStateModel;
  readonly blocks: readonly SeparableBlock[];
  /** Full θ (every model parameter, fixed ones at their value). */
  readonly theta: Float64Array;
  /** Indices into θ of the parameters being fitted. */
  readonly free: Int32Array;
  /** Σ JᵀJ over blocks (free × free, row-major), with respect to θ in natural units. */
  readonly jtj: Float64Array;
  /** Σ Jᵀr over blocks. */
  readonly jtr: Float64Array;
  /** Σ ‖r‖² over blocks. */
  rss = 0;
  /** Number of evaluations so far. */
  evaluations = 0;

  constructor(model: SteadyStateModel, blocks: readonly SeparableBlock[], theta: ArrayLike<number>, free: ArrayLike<number>) {
    this.model = model;
    this.blocks = blocks;
    this.theta = Float64Array.from(theta);
    this.free = Int32Array.from(free);
    const p = this.free.length;
    this.jtj = new Float64Array(p * p);
    this.jtr = new Float64Array(p);
  }

  /**
   * Evaluate every block at the free parameter values (natural units).
   * With `withJacobian`, also accumulate JᵀJ and Jᵀr. Returns false when any
   * block is degenerate there.
   */
  evaluate(freeValues: ArrayLike<number>, withJacobian: boolean): boolean {
    const free = this.free;
    const p = free.length;
    for (let k = 0; k < p; k++) this.theta[free[k]] = freeValues[k];
    this.evaluations++;
    let rss = 0;
    const jtj = this.jtj;
    const jtr = this.jtr;
    if (withJacobian) {
      jtj.fill(0);
      jtr.fill(0);
    }
    for (const block of this.blocks) {
      if (!block.evaluate(this.model, this.theta, withJacobian ? free : null)) return false;
      rss += block.rss;
      if (withJacobian) block.accumulate(free, jtj, jtr);
    }
    this.rss = rss;
    return Number.isFinite(rss);
  }
}
