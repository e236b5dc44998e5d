import { describe, expect, it } from "vitest";
import { i0e, i1e } from "../../../server/analysis/special/scaledBessel.ts";
import { rodStripDeficit, spotRecovery, stripRecovery } from "../../../server/analysis/dynamics/frap/recoveryShapes.ts";
import { recoveryHalfTime } from "../../../server/analysis/dynamics/frap/recoveryModel.ts";
import { influxBuildUp } from "../../../server/analysis/dynamics/buildUp/influxBuildUp.ts";
import { solveReactionDiffusion } from "../../../server/analysis/dynamics/solver/solveReactionDiffusion.ts";
import { SolverSettings } from "../../../server/analysis/dynamics/solver/solverSettings.ts";
import type { ReactionDiffusionProblem } from "../../../server/analysis/dynamics/solver/reactionDiffusionProblem.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

const zs = [1e-6, 0.01, 0.5, 1, 3.7, 12, 19.9, 20.1, 35, 300, 709, 711, 5000, 1e6];
const stripRatios = [1e-4, 0.01, 0.3, 1, 4, 25, 400, 5000];
const buildUp = [
  [0, 10, 0.5, 0.01, 2], [3, 60, 0.5, 0.01, 2], [40, 100, 0.3, 2e-4, 1], [800, 50, 0.3, 0.01, 1], [5, 1e5, 0.2, 1e-3, 1], [7000, 2e4, 1, 1e-3, 1],
];
// Source: scipy.special (i0e, i1e, erfc, erfcx) as the outside reference on identical inputs.
const ref = await runPython<{ i0e: number[]; i1e: number[]; spot: number[]; strip: number[]; build: number[]; rod: number[] }>(
  `
from scipy import special
import math
def strip(r):
    return float(special.erfc(math.sqrt(r)) + math.sqrt(1/(math.pi*r))*(-math.expm1(-r)))
def build(x, t, D, k, j0):
    lam = math.sqrt(D/k); a = x/math.sqrt(4*D*t); b = math.sqrt(k*t)
    # log-space form: e^(-a^2-kt) [erfcx(a-b) - erfcx(a+b)], the first term direct where a-b < 0
    common = math.exp(-a*a - k*t)
    first = math.exp(-x/lam)*special.erfc(a-b) if a-b < 0 else common*special.erfcx(a-b)
    return float(j0*lam/(2*D)*(first - common*special.erfcx(a+b)))
def rod(t, x1, x2, L, D):
    n = np.arange(1, 400001)
    a = 2/(n*np.pi)*(np.sin(n*np.pi*x2/L) - np.sin(n*np.pi*x1/L))
    return float((x2-x1)/L + L/(2*(x2-x1))*np.sum(a*a*np.exp(-D*n*n*np.pi**2*t/L**2)))
result = {
  "i0e": [float(special.i0e(z)) for z in data["z"]],
  "i1e": [float(special.i1e(z)) for z in data["z"]],
  "spot": [float(special.i0e(z) + special.i1e(z)) for z in data["z"]],
  "strip": [strip(r) for r in data["r"]],
  "build": [build(*row) for row in data["b"]],
  "rod": [rod(*row) for row in data["rod"]],
}
`,
  { z: zs, r: stripRatios, b: buildUp, rod: [[2, 4, 6, 20, 1], [30, 4, 6, 20, 1], [0.5, 0, 3, 10, 0.4], [200, 0, 3, 10, 0.4], [5, 9, 10, 10, 0.2]] },
);

describe("FRAP recovery shapes against scipy.special", () => {
  it("i0e and i1e match scipy within 1e-13 relative, including z > 710 where I0 overflows", () => {
    zs.forEach((z, i) => {
      expect(relativeDifference(i0e(z), ref.i0e[i])).toBeLessThan(1e-13);
      expect(relativeDifference(i1e(z), ref.i1e[i])).toBeLessThan(1e-13);
    });
  });

  it("spotRecovery equals i0e(z) + i1e(z) with z = w²/(2Dt) (Soumpasis 1983)", () => {
    // Source: Soumpasis 1983, Biophys J 41:95; scipy.special.i0e/i1e as reference.
    zs.forEach((z, i) => {
      // w = 1, D = 1: t = 1/(2z).
      expect(relativeDifference(spotRecovery(1 / (2 * z), 1, 1), ref.spot[i])).toBeLessThan(1e-13);
    });
  });

  it("stripRecovery equals erfc(√(τ/t)) + √(t/πτ)(1 − e^(−τ/t)) evaluated with scipy", () => {
    // Source: science notes §3 [derived]; scipy.special.erfc as reference.
    stripRatios.forEach((r, i) => {
      // w = 2, D = 1: τ = 1, t = 1/r.
      expect(relativeDifference(stripRecovery(1 / r, 2, 1), ref.strip[i])).toBeLessThan(1e-12);
    });
  });

  it("influxBuildUp equals the erfc/erfcx build-up evaluated with scipy, far from the source too", () => {
    // Source: science notes §2 (minus sign between the terms; erfcx form); scipy.special.erfc/erfcx as reference.
    buildUp.forEach((row, i) => {
      const v = influxBuildUp(row[0], row[1], row[2], row[3], row[4]);
      expect(Number.isFinite(v)).toBe(true);
      if (ref.build[i] === 0) expect(v).toBe(0);
      else expect(relativeDifference(v, ref.build[i])).toBeLessThan(1e-9);
    });
  });

  it("rodStripDeficit (series and image sums) matches a 400 000-term numpy series", () => {
    // Source: science notes §3 cosine series [derived]; numpy evaluation as reference.
    const rows = [[2, 4, 6, 20, 1], [30, 4, 6, 20, 1], [0.5, 0, 3, 10, 0.4], [200, 0, 3, 10, 0.4], [5, 9, 10, 10, 0.2]];
    rows.forEach((r, i) => expect(Math.abs(rodStripDeficit(r[0], r[1], r[2], r[3], r[4]) - ref.rod[i])).toBeLessThan(1e-6));
  });

  it("the image sum (Dt/L² < 0.05) and the series (≥ 0.05) meet continuously at the switch", () => {
    // Source: consistency of two exact representations [derived]. L = 10 µm, D = 1 µm²/s: the switch is at t = 5 s.
    const below = rodStripDeficit(4.99999, 2, 5, 10, 1);
    const above = rodStripDeficit(5.0, 2, 5, 10, 1);
    expect(Math.abs(below - above)).toBeLessThan(1e-6);
  });

  it("half-times: t½ ≈ 0.8946·w²/(4D) for the spot and ≈ 0.925·w²/(4D) for the strip", () => {
    // Source: science notes §3 (Soumpasis 1983 for the spot; strip [derived]).
    expect(recoveryHalfTime({ kind: "spot", radiusUm: 2 }, 0.5, 0) / (4 / 2)).toBeCloseTo(0.8946, 3);
    expect(recoveryHalfTime({ kind: "strip", widthUm: 2 }, 0.5, 0) / (4 / 2)).toBeCloseTo(0.925, 3);
  });

  it("the often-quoted strip approximation is off by about 0.056 somewhere (why it is not used)", () => {
    // Source: science notes §3.
    let worst = 0;
    for (let r = 0.01; r < 100; r *= 1.05) {
      const t = 1 / r;
      worst = Math.max(worst, Math.abs(stripRecovery(t, 2, 1) - (1 - Math.sqrt(4 / (4 + 4 * Math.PI * t)))));
    }
    expect(worst).toBeGreaterThan(0.05);
    expect(worst).toBeLessThan(0.06);
  });
});

describe("FRAP recovery shapes against the solver", () => {
  const problem = (over: Partial<ReactionDiffusionProblem>): ReactionDiffusionProblem => ({
    geometry: "line", lengthUm: 1, cells: 10, diffusionUm2PerS: 1, degradationPerS: 0, degradationOrder: 1, source: null,
    left: { kind: "flux", influx: 0 }, right: { kind: "flux", influx: 0 }, initial: null, ...over,
  });
  const settings = SolverSettings.parse({ tolerance: 1e-7 });

  it("spot: mean over the bleached disc of the radial 2D solution follows Soumpasis within 2e-3", () => {
    // Source: Soumpasis 1983, Biophys J 41:95 (infinite plane; the disc of radius 15w stands in for it).
    const w = 2;
    const cells = 600;
    const lengthUm = 15 * w;
    const h = lengthUm / cells;
    const initial = new Float64Array(cells).map((_, i) => ((i + 0.5) * h < w ? 0 : 1));
    const times = [0.2, 1, 4, 20];
    const run = solveReactionDiffusion(problem({ geometry: "disc", lengthUm, cells, diffusionUm2PerS: 0.5, initial }), times, settings);
    times.forEach((t, m) => {
      let mass = 0;
      let area = 0;
      for (let i = 0; i < cells && (i + 1) * h <= w + 1e-9; i++) {
        const v = 0.5 * (((i + 1) * h) ** 2 - (i * h) ** 2);
        mass += run.profiles[m][i] * v;
        area += v;
      }
      expect(Math.abs(mass / area - spotRecovery(t, w, 0.5))).toBeLessThan(2e-3);
    });
  });

  it("strip and rod: the strip mean of the 1D solution follows the closed forms within 1e-3", () => {
    // Source: science notes §3 [derived]; the solver as an independent check.
    const cells = 1000;
    const lengthUm = 50;
    const h = lengthUm / cells;
    const [x1, x2] = [24, 26];
    const initial = new Float64Array(cells).map((_, i) => ((i + 0.5) * h > x1 && (i + 0.5) * h < x2 ? 0 : 1));
    const times = [0.1, 1, 5, 40, 2000];
    const run = solveReactionDiffusion(problem({ lengthUm, cells, diffusionUm2PerS: 0.3, initial }), times, settings);
    const stripMean = (c: Float64Array) => {
      let s = 0;
      let m = 0;
      for (let i = 0; i < cells; i++) if ((i + 0.5) * h > x1 && (i + 0.5) * h < x2) { s += c[i]; m++; }
      return s / m;
    };
    times.forEach((t, m) => {
      const rod = 1 - rodStripDeficit(t, x1, x2, lengthUm, 0.3);
      expect(Math.abs(stripMean(run.profiles[m]) - rod)).toBeLessThan(1e-3);
      // Until the deficit reaches the ends (√(4Dt) ≪ 24 µm) the rod behaves like the infinite line.
      if (t <= 40) expect(Math.abs(stripMean(run.profiles[m]) - stripRecovery(t, x2 - x1, 0.3))).toBeLessThan(1e-3);
    });
    // The plateau 1 − w/L: bleached molecules stay in the closed rod.
    expect(stripMean(run.profiles[4])).toBeCloseTo(1 - 2 / 50, 3);
  });
});
