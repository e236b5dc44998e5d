import { describe, expect, it } from "vitest";
import { cholesky } from "../../../server/analysis/linalg/cholesky.ts";
import { runPython } from "../../helpers/python.ts";

describe("cholesky against numpy.linalg.cholesky", () => {
  it("cholesky matches numpy for a 3×3 covariance to 1e-13 and returns null for an indefinite matrix", async () => {
    const a = [[4, 1.2, -0.4], [1.2, 2, 0.3], [-0.4, 0.3, 0.9]];
    // Source: numpy.linalg.cholesky as reference.
    const ref = await runPython<number[][]>(`result = np.linalg.cholesky(np.array(data)).tolist()`, a);
    const l = cholesky(a);
    expect(l).not.toBeNull();
    l!.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(ref[i][j], 13)));
    expect(cholesky([[1, 2], [2, 1]])).toBeNull();
  });
});
