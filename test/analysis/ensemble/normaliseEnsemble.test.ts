import { describe, expect, it } from "vitest";
import { acrossEmbryoVariance } from "../../../server/analysis/ensemble/acrossEmbryoVariance.ts";
import { normaliseEnsemble } from "../../../server/analysis/ensemble/normaliseEnsemble.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";

const x = Array.from({ length: 101 }, (_, k) => 4 * k);
const random = createRandom(81);
const scale = Array.from({ length: 25 }, () => Math.exp(0.4 * random.normal()));
const offset = Array.from({ length: 25 }, () => 50 + 30 * random.normal());
const embryos = scale.map((_, i) => `e${i}`);
const shape = x.map((v) => 1000 * Math.exp(-v / 90));

describe("normaliseEnsemble", () => {
  it("'scale-offset' removes a per-embryo scale factor and offset exactly (1e-9) and keeps the group mean in place", () => {
    // Source: least-squares fit c_i = a_i·m + b_i; with c_i = A_i·f + B_i the fixed point with mean(a) = 1,
    // mean(b) = 0 maps every embryo onto the raw group mean (algebra of the model, no outside source).
    const values = scale.map((a, i) => Float64Array.from(shape, (f) => a * f + offset[i]));
    const r = normaliseEnsemble(embryos, values, "scale-offset");
    const rawMean = shape.map((_, k) => values.reduce((s, v) => s + v[k], 0) / values.length);
    expect(r.converged).toBe(true);
    r.values.forEach((v) => v.forEach((c, k) => expect(Math.abs(c - rawMean[k])).toBeLessThan(1e-9 * 1000)));
    const meanScale = scale.reduce((s, v) => s + v, 0) / scale.length;
    r.perEmbryo.forEach((e, i) => expect(e.scale).toBeCloseTo(scale[i] / meanScale, 9));
    expect(r.variance.after.meanVariance).toBeLessThan(1e-12 * r.variance.before.meanVariance);
    expect(r.variance.fractionRemoved!).toBeCloseTo(1, 9);
  });

  it("'scale-offset' leaves shape differences: with different decay lengths the result is the scale-free result up to one common affine map", () => {
    // Source: the normalisation is equivariant under per-embryo affine maps of the data (algebra of the
    // least-squares fit), so A_i·f_i + B_i and f_i normalise to the same profiles up to one global a·y + b.
    const lambdas = scale.map(() => 90 * (1 + 0.15 * random.normal()));
    const pure = lambdas.map((l) => Float64Array.from(x, (v) => 1000 * Math.exp(-v / l)));
    const scaled = pure.map((v, i) => Float64Array.from(v, (c) => scale[i] * c + offset[i]));
    const a = normaliseEnsemble(embryos, scaled, "scale-offset", { tolerance: 1e-15 });
    const b = normaliseEnsemble(embryos, pure, "scale-offset", { tolerance: 1e-15 });
    const ys = a.values.flatMap((v) => Array.from(v));
    const zs = b.values.flatMap((v) => Array.from(v));
    const my = ys.reduce((s, v) => s + v, 0) / ys.length;
    const mz = zs.reduce((s, v) => s + v, 0) / zs.length;
    const slope = ys.reduce((s, v, i) => s + (v - my) * (zs[i] - mz), 0) / zs.reduce((s, v) => s + (v - mz) ** 2, 0);
    const residual = Math.max(...ys.map((v, i) => Math.abs(v - (my + slope * (zs[i] - mz)))));
    expect(residual).toBeLessThan(1e-9 * 1000);
    // Shape differences survive: embryos still differ, and a longer decay length (a less curved profile)
    // still lies higher mid-axis once scale and offset are matched — rank correlation with λ near 1.
    expect(acrossEmbryoVariance(b.values).meanVariance).toBeGreaterThan(0.1 * acrossEmbryoVariance(pure).meanVariance);
    const rank = (v: number[]) => {
      const order = v.map((_, i) => i).sort((i, j) => v[i] - v[j]);
      const r = new Array<number>(v.length);
      order.forEach((i, k) => (r[i] = k));
      return r;
    };
    const rl = rank(lambdas);
    const rm = rank(a.values.map((v) => v[50]));
    const n = rl.length;
    const spearman = 1 - (6 * rl.reduce((s, v, i) => s + (v - rm[i]) ** 2, 0)) / (n * (n * n - 1));
    expect(spearman).toBeGreaterThan(0.9);
  });

  it("'minmax' maps each embryo to [0, 1] and reports the scale and offset it used", () => {
    // Source: definition of min–max scaling.
    const values = scale.map((a, i) => Float64Array.from(shape, (f) => a * f + offset[i]));
    const r = normaliseEnsemble(embryos, values, "minmax");
    r.values.forEach((v) => {
      expect(Math.min(...v)).toBeCloseTo(0, 14);
      expect(Math.max(...v)).toBeCloseTo(1, 14);
    });
    expect(r.perEmbryo[0].offset).toBeCloseTo(Math.min(...values[0]), 12);
  });

  it("reports instead of failing when a method cannot apply", () => {
    // common practice, no source.
    const flat = [Float64Array.from(x, () => 3), Float64Array.from(x, () => 3)];
    const r = normaliseEnsemble(["p", "q"], flat, "minmax");
    expect(r.applied).toBe(false);
    expect(r.reason).toBe('embryo "p" is constant on the grid, so min–max scaling is undefined');
    const reversed = [Float64Array.from(shape), Float64Array.from(shape).reverse(), Float64Array.from(shape)];
    const s = normaliseEnsemble(["p", "q", "r"], reversed, "scale-offset");
    expect(s.applied).toBe(false);
    expect(s.reason).toMatch(/embryo "q" has a fitted scale ≤ 0/);
  });
});
