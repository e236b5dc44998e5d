import { describe, expect, it } from "vitest";
import { SeparableBlock } from "../../../server/analysis/fit/separableBlock.ts";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { sourceModel } from "../../../server/analysis/models/source.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

const random = createRandom(8);
const x = positions(0, 200, 80);
const y = simulateProfile("source", x, [30, 40], 60, 7, { noiseSd: 1, random });
const w = x.map(() => 0.5 + random.uniform());

function block(fitBackground: boolean): SeparableBlock {
  const b = new SeparableBlock(Float64Array.from(x), Float64Array.from(y), Infinity, fitBackground, 2);
  b.setWeights(w);
  return b;
}

describe("SeparableBlock", () => {
  it("solves amplitude and background as numpy.linalg.lstsq does on the weighted basis", async () => {
    // Source: numpy.linalg.lstsq as reference on [√w·g, √w] and √w·y.
    const b = block(true);
    expect(b.evaluate(sourceModel, Float64Array.of(25, 50), null)).toBe(true);
    const g = Array.from(b.basisValues);
    const ref = await runPython<{ coef: number[]; rss: number }>(
      `
sw = np.sqrt(np.array(data["w"])); g = np.array(data["g"]); y = np.array(data["y"])
A = np.stack([sw * g, sw], axis=1)
coef, res, rank, sv = np.linalg.lstsq(A, sw * y, rcond=None)
result = {"coef": coef, "rss": float(np.sum((sw * y - A @ coef) ** 2))}
`,
      { w, g, y },
    );
    expect(relativeDifference(b.amplitude, ref.coef[0])).toBeLessThan(1e-12);
    expect(relativeDifference(b.background, ref.coef[1])).toBeLessThan(1e-12);
    expect(relativeDifference(b.rss, ref.rss)).toBeLessThan(1e-12);
  });

  it("gives the exact gradient of the projected RSS: d(RSS)/dθ = 2Jᵀr, by central differences", () => {
    // Source: Golub & Pereyra 1973 (the gradient of the variable-projection functional); common practice.
    for (const fitBackground of [true, false]) {
      const b = block(fitBackground);
      const theta = Float64Array.of(25, 50);
      const free = Int32Array.of(0, 1);
      b.evaluate(sourceModel, theta, free);
      const jtj = new Float64Array(4);
      const jtr = new Float64Array(2);
      b.accumulate(free, jtj, jtr);
      for (let j = 0; j < 2; j++) {
        const h = 1e-6 * theta[j];
        const up = Float64Array.from(theta);
        const down = Float64Array.from(theta);
        up[j] += h;
        down[j] -= h;
        b.evaluate(sourceModel, up, null);
        const rUp = b.rss;
        b.evaluate(sourceModel, down, null);
        const fd = (rUp - b.rss) / (2 * h);
        expect(relativeDifference(2 * jtr[j], fd)).toBeLessThan(1e-6);
      }
    }
  });

  it("accumulates Kaufman's JᵀJ = (P⊥T)ᵀ(P⊥T), checked by explicit projection in numpy", async () => {
    // Source: Kaufman 1975, BIT (J = −P⊥·∂Φ/∂θ·α); numpy as reference for the projection.
    const b = block(true);
    const theta = Float64Array.of(25, 50);
    const free = Int32Array.of(0, 1);
    b.evaluate(sourceModel, theta, free);
    const jtj = new Float64Array(4);
    b.accumulate(free, jtj, new Float64Array(2));
    const ref = await runPython<number[][]>(
      `
sw = np.sqrt(np.array(data["w"])); g = np.array(data["g"]); A = data["A"]
Phi = np.stack([sw * g, sw], axis=1)
T = np.stack([sw * A * np.array(d) for d in data["dg"]], axis=1)
P = np.eye(len(g)) - Phi @ np.linalg.pinv(Phi)
J = P @ T
result = J.T @ J
`,
      { w, g: Array.from(b.basisValues), A: b.amplitude, dg: b.basisDerivatives.map((d) => Array.from(d)) },
    );
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) expect(relativeDifference(jtj[i * 2 + j], ref[i][j])).toBeLessThan(1e-9);
  });

  it("reports a degenerate basis instead of dividing by zero", () => {
    // common practice, no source: e^(−x/λ) with λ = 1e20 µm is the constant 1 in double precision,
    // collinear with the background.
    const b = new SeparableBlock(Float64Array.from(x), Float64Array.from(y), Infinity, true, 1);
    expect(b.evaluate(exponentialModel, Float64Array.of(1e20), Int32Array.of(0))).toBe(false);
  });
});
