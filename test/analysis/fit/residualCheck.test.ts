import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { fitProfile, type ProfileFit } from "../../../server/analysis/fit/fitProfile.ts";
import { residualCheck } from "../../../server/analysis/fit/residualCheck.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

describe("residualCheck", () => {
  const random = createRandom(314);
  const fitted = Array.from({ length: 80 }, (_, i) => 100 * Math.exp(-i / 20) + 5);
  const residuals = fitted.map((m) => 0.1 * m * random.normal());

  it("Spearman ρ and p of |residual| against fitted intensity match scipy.stats.spearmanr; runs match the Wald–Wolfowitz formula", async () => {
    // Source: scipy.stats.spearmanr as reference; runs test: Wald & Wolfowitz 1940, Ann Math Stat
    // (E = 1 + 2n₊n₋/n, Var = 2n₊n₋(2n₊n₋ − n)/(n²(n − 1)), one-sided normal p for too few runs).
    const check = residualCheck(fitted, residuals, "hc3", []);
    const ref = await runPython<{ rho: number; p: number; runs: number; z: number; pRuns: number }>(
      `
from scipy import stats
f = np.array(data["f"]); r = np.array(data["r"])
rho, p = stats.spearmanr(f, np.abs(r))
s = np.sign(r); s = s[s != 0]
runs = 1 + int(np.sum(s[1:] != s[:-1])); n1 = int(np.sum(s > 0)); n2 = int(np.sum(s < 0)); n = n1 + n2
E = 1 + 2 * n1 * n2 / n; V = 2 * n1 * n2 * (2 * n1 * n2 - n) / (n**2 * (n - 1))
z = (runs - E) / np.sqrt(V)
result = {"rho": rho, "p": p, "runs": runs, "z": z, "pRuns": stats.norm.cdf(z)}
`,
      { f: fitted, r: residuals },
    );
    expect(relativeDifference(check.intensityTrend!.spearman, ref.rho)).toBeLessThan(1e-10);
    expect(relativeDifference(check.intensityTrend!.p, ref.p)).toBeLessThan(1e-6);
    expect(check.runs!.runs).toBe(ref.runs);
    expect(check.runs!.z).toBeCloseTo(ref.z, 10);
    expect(check.runs!.p).toBeCloseTo(ref.pRuns, 8);
    expect(check.verdict).toContain("noise-grows-with-intensity");
  });

  it("warns about classic error bars under noise that grows with intensity, and not under the default hc3", () => {
    // common practice, no source: the warning must say how to fix it.
    const classic: string[] = [];
    residualCheck(fitted, residuals, "classic", classic);
    expect(classic.join(" ")).toMatch(/grow with the fitted intensity.*"hc3"/);
    const hc3: string[] = [];
    residualCheck(fitted, residuals, "hc3", hc3);
    expect(hc3).toEqual([]);
  });

  it("flags a wrong model by runs: a power-law profile fitted with an exponential", () => {
    // Source: science.md §1 — power-law gradients are not exponentials; the misfit is systematic.
    const x = positions(0, 300, 100);
    const r2 = createRandom(5);
    const y = simulateProfile("power", x, [20], 200, 5).map((m) => m + 0.3 * r2.normal());
    const fit = fitProfile(x, y, FitOptions.parse({ autoWindow: false })) as ProfileFit;
    expect(fit.residualCheck.verdict).toContain("systematic-residuals");
    expect(fit.warnings.join(" ")).toMatch(/run in long stretches of one sign.*--model all/);
    const right = fitProfile(x, y, FitOptions.parse({ model: "power", autoWindow: false })) as ProfileFit;
    expect(right.residualCheck.verdict).not.toContain("systematic-residuals");
  });
});
