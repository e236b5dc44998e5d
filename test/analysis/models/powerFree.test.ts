import { describe, expect, it } from "vitest";
import { powerModel } from "../../../server/analysis/models/power.ts";
import { powerFreeModel } from "../../../server/analysis/models/powerFree.ts";
import { evaluateBasis, grid, jacobianDiscrepancy } from "./basisCheck.ts";

describe("powerFreeModel", () => {
  it("solves D c'' = k cⁿ with n = 1 + 2/m and the declared D/k", () => {
    // Source: Eldar, Rosin, Shilo, Barkai 2003, Dev Cell: c = A'/(x+ε)^m, m = 2/(n−1), A' = [m(m+1)D/k]^(1/(n−1)).
    const x0 = 20;
    const m = 1.3;
    const amplitude = 4;
    const n = 1 + 2 / m;
    const gradient = new Float64Array(4);
    const ratio = powerFreeModel.derived.find((d) => d.name === "diffusionOverDegradationUm2Au")!;
    const dOverK = ratio.evaluate([x0, m], amplitude, 0, gradient);
    for (const xi of [1, 15, 80, 300]) {
      // Step scaled with the local length scale x + x0 to balance truncation and rounding.
      const h = 1e-3 * (xi + x0);
      const [cm, c0, cp] = evaluateBasis(powerFreeModel, [xi - h, xi, xi + h], [x0, m]).value.map((g) => amplitude * g);
      const kOverD = (cp - 2 * c0 + cm) / (h * h) / c0 ** n;
      expect(Math.abs(kOverD * dOverK - 1)).toBeLessThan(1e-5);
    }
  });

  it("reduces to the power model at m = 2", () => {
    // Source: n = 2 gives m = 2 (Eldar et al. 2003).
    const x = grid(0, 400, 81);
    const free = evaluateBasis(powerFreeModel, x, [35, 2]).value;
    const fixed = evaluateBasis(powerModel, x, [35]).value;
    free.forEach((v, i) => expect(Math.abs(v - fixed[i])).toBeLessThan(1e-15));
  });

  it("analytic ∂g/∂x0 and ∂g/∂m agree with central finite differences", () => {
    // common practice, no source
    expect(jacobianDiscrepancy(powerFreeModel, grid(0, 500, 101), [30, 2.5])).toBeLessThan(1e-7);
    expect(jacobianDiscrepancy(powerFreeModel, grid(0, 100, 101), [200, 15])).toBeLessThan(1e-7);
  });

  it("derived quantities' gradients agree with central finite differences", () => {
    // common practice, no source
    const params = [30, 1.7, 6];
    for (const quantity of powerFreeModel.derived) {
      const gradient = new Float64Array(4);
      quantity.evaluate([params[0], params[1]], params[2], 0, gradient);
      params.forEach((p, j) => {
        const h = 1e-6 * p;
        const up = params.slice();
        const down = params.slice();
        up[j] += h;
        down[j] -= h;
        const scratch = new Float64Array(4);
        const fd = (quantity.evaluate([up[0], up[1]], up[2], 0, scratch) - quantity.evaluate([down[0], down[1]], down[2], 0, scratch)) / (2 * h);
        const index = j < 2 ? j : 2;
        expect(Math.abs(fd - gradient[index])).toBeLessThan(1e-6 * Math.max(1, Math.abs(fd)));
      });
    }
  });
});
