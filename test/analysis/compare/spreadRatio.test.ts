import { describe, expect, it } from "vitest";
import { boundarySpreadRatio, suppliedSpreadRatio } from "../../../server/analysis/compare/spreadRatio.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython } from "../../helpers/python.ts";

const gen = createRandom(55);
const a = Array.from({ length: 25 }, () => 200 + 8 * gen.normal());
const b = Array.from({ length: 22 }, () => 185 + 5 * gen.normal());
const B = 20000;
// Source: scipy.stats.bootstrap(method='BCa') of the SD ratio, resampling each group independently.
const ref = await runPython<{ ratio: number; ci: [number, number] }>(
  `
from scipy import stats
x, y = np.array(data["a"]), np.array(data["b"])
f = lambda u, v, axis: np.std(u, ddof=1, axis=axis) / np.std(v, ddof=1, axis=axis)
r = stats.bootstrap((x, y), f, n_resamples=${B}, method="BCa", vectorized=True, rng=np.random.default_rng(2))
result = {"ratio": float(f(x, y, 0)), "ci": [float(r.confidence_interval.low), float(r.confidence_interval.high)]}
`,
  { a, b },
);

describe("spreadRatio", () => {
  it("boundarySpreadRatio gives the SD ratio with scipy's BCa interval within Monte-Carlo error", () => {
    const s = boundarySpreadRatio(a, b, { bootstrap: B, level: 0.95, interval: "bca", random: createRandom(6) });
    expect(s.ratio.value).toBeCloseTo(ref.ratio, 12);
    // Tolerance: 0.14 × bootstrap SE of the ratio (≈ SE of ln ratio × ratio); derivation in
    // test/analysis/stats/bootstrapInterval.test.ts.
    const tol = 0.14 * s.se_log_ratio! * s.ratio.value;
    expect(Math.abs(s.ratio.ci95![0] - ref.ci[0])).toBeLessThan(tol);
    expect(Math.abs(s.ratio.ci95![1] - ref.ci[1])).toBeLessThan(tol);
    expect(s.equal_spread_plausible).toBe(ref.ci[0] <= 1 && ref.ci[1] >= 1);
  });

  it("suppliedSpreadRatio uses the delta method on the log scale without replicates", () => {
    // Source: delta method, Var(ln X) ≈ Var(X)/X² (Casella & Berger 2002, Statistical Inference, §5.5.4).
    const s = suppliedSpreadRatio(
      { estimate: { value: 8, se: 0.8, ci95: null } },
      { estimate: { value: 5, se: null, ci95: [4, 6] } },
      { bootstrap: 1000, level: 0.95, interval: "percentile", random: createRandom(1) },
    );
    const seB = 2 / (2 * 1.959963984540054);
    const seLog = Math.hypot(0.1, seB / 5);
    expect(s.se_log_ratio).toBeCloseTo(seLog, 12);
    expect(s.ratio.ci95![1]).toBeCloseTo(1.6 * Math.exp(1.959963984540054 * seLog), 10);
    expect(s.difference.ci95![0]).toBeCloseTo(3 - 1.959963984540054 * Math.hypot(0.8, seB), 10);
  });

  it("suppliedSpreadRatio pairs independent bootstrap replicates: log-normal replicates give the log-normal interval", () => {
    // Source: for independent log-normal replicates, ln(ratio) is normal with variance s₁² + s₂²,
    // so the 95% interval is r·exp(±1.96·√(s₁² + s₂²)) (standard property of the normal distribution).
    const rng = createRandom(21);
    const repA = Array.from({ length: 4000 }, () => 8 * Math.exp(0.1 * rng.normal()));
    const repB = Array.from({ length: 4000 }, () => 5 * Math.exp(0.15 * rng.normal()));
    const s = suppliedSpreadRatio(
      { estimate: { value: 8, se: null, ci95: null }, replicates: repA },
      { estimate: { value: 5, se: null, ci95: null }, replicates: repB },
      { bootstrap: 4000, level: 0.95, interval: "percentile", random: createRandom(3) },
    );
    const sd = Math.hypot(0.1, 0.15);
    expect(s.se_log_ratio!).toBeCloseTo(sd, 2);
    expect(Math.log(s.ratio.ci95![0] / 1.6)).toBeCloseTo(-1.959964 * sd, 1);
    expect(Math.log(s.ratio.ci95![1] / 1.6)).toBeCloseTo(1.959964 * sd, 1);
  });
});
