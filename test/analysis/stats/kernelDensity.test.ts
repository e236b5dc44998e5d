import { describe, expect, it } from "vitest";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { gaussianKernelDensity, silvermanBandwidth } from "../../../server/analysis/stats/kernelDensity.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";

const random = createRandom(5);
const samples = Array.from({ length: 80 }, () => 3 + 2 * random.normal());
const at = [-4, 0, 2.5, 3, 6, 11];

describe("kernel density", () => {
  it("gaussianKernelDensity matches scipy.stats.gaussian_kde with the same bandwidth to 1e-12 relative", async () => {
    const h = silvermanBandwidth(samples);
    // Source: scipy.stats.gaussian_kde as reference; its kernel SD is bw_method × sample SD (ddof 1),
    // so bw_method = h / SD gives the same bandwidth.
    const ref = await runPython<{ density: number[]; iqr: number; sd: number }>(
      `
from scipy import stats
s = np.array(data["samples"])
kde = stats.gaussian_kde(s, bw_method=data["h"] / s.std(ddof=1))
q75, q25 = np.percentile(s, [75, 25])
result = {"density": kde(np.array(data["at"])).tolist(), "iqr": float(q75 - q25), "sd": float(s.std(ddof=1))}
`,
      { samples, h, at },
    );
    gaussianKernelDensity(samples, h, at).forEach((v, i) => expect(relativeDifference(v, ref.density[i])).toBeLessThan(1e-12));
    // Source: Silverman 1986, eq. 3.31: h = 0.9·min(SD, IQR/1.34)·n^(−1/5), with numpy's percentiles.
    expect(h).toBeCloseTo(0.9 * Math.min(ref.sd, ref.iqr / 1.34) * 80 ** -0.2, 12);
  });
  it("gaussianKernelDensity integrates to 1", () => {
    // Source: a kernel density is a mixture of unit-mass kernels (definition).
    const xs = Array.from({ length: 4001 }, (_, k) => -10 + k * 0.006);
    const d = gaussianKernelDensity(samples, 0.7, xs);
    const integral = d.reduce((s, v) => s + v * 0.006, 0);
    expect(integral).toBeCloseTo(1, 6);
  });
});
