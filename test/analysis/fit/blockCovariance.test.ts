import { describe, expect, it } from "vitest";
import { blockCovariance } from "../../../server/analysis/fit/blockCovariance.ts";
import { ProjectedProblem } from "../../../server/analysis/fit/projectedProblem.ts";
import { SeparableBlock } from "../../../server/analysis/fit/separableBlock.ts";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

describe("blockCovariance", () => {
  it("equals s²(JᵀJ)⁻¹ of the full Jacobian over [λ, A₁, B₁, A₂, B₂], inverted by numpy", async () => {
    // Source: numpy.linalg.inv of the explicitly assembled JᵀJ as reference (Schur complement identity).
    const random = createRandom(13);
    const xs = [positions(0, 150, 40), positions(10, 220, 55)];
    const ys = xs.map((x, k) => simulateProfile("exponential", x, [35], 50 + 30 * k, 4 + k, { noiseSd: 1, random }));
    const blocks = xs.map((x, k) => new SeparableBlock(Float64Array.from(x), Float64Array.from(ys[k]), Infinity, true, 1));
    const problem = new ProjectedProblem(exponentialModel, blocks, [38], [0]);
    problem.evaluate([38], true);
    const s2 = 1.7;
    const cov = blockCovariance(problem, s2)!;
    const ref = await runPython<number[][]>(
      `
l = data["lambda"]; rows = []
for k, (x, A) in enumerate(zip(data["xs"], data["A"])):
    x = np.array(x); e = np.exp(-x / l)
    J = np.zeros((len(x), 5)); J[:, 0] = A * x / l**2 * e; J[:, 1 + 2 * k] = e; J[:, 2 + 2 * k] = 1
    rows.append(J)
J = np.vstack(rows)
result = data["s2"] * np.linalg.inv(J.T @ J)
`,
      { xs, A: blocks.map((b) => b.amplitude), lambda: 38, s2 },
    );
    expect(relativeDifference(cov.nonlinear[0][0], ref[0][0])).toBeLessThan(1e-9);
    for (let k = 0; k < 2; k++) {
      for (let r = 0; r < 2; r++) {
        expect(relativeDifference(cov.cross[k][r][0], ref[1 + 2 * k + r][0])).toBeLessThan(1e-9);
        for (let c = 0; c < 2; c++) expect(relativeDifference(cov.linear[k][r][c], ref[1 + 2 * k + r][1 + 2 * k + c])).toBeLessThan(1e-9);
      }
    }
  });
});
