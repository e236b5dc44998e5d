import { describe, expect, it } from "vitest";
import { dkRegionFigure, JOINT_95_RADIUS, jointRegion95 } from "../../client/figures/dkRegionFigure.ts";
import { runPython } from "../helpers/python.ts";
import { buildUpInput } from "./dynamicsFixtures.ts";

describe("the joint D–k region", () => {
  it("jointRegion95 lies on the ellipse (θ − θ̂)ᵀC⁻¹(θ − θ̂) = χ²₂(0.95) for any correlation, as numpy and scipy.stats.chi2 compute it", async () => {
    // Source: scipy.stats.chi2.ppf(0.95, 2) and numpy.linalg.inv as outside references (bivariate normal confidence ellipse).
    const cases = [0, 0.8, -0.95].map((r) => {
      const d = { value: 1.3, se: 0.05 };
      const k = { value: 2e-4, se: 1e-5 };
      return { r, d, k, points: jointRegion95(d, k, r, 24).map((p) => [p.dUm2PerS, p.kPerS]) };
    });
    const ref = await runPython<{ ppf: number; forms: number[][] }>(
      `
from scipy import stats
forms = []
for c in data:
    sd, sk, r = c["d"]["se"], c["k"]["se"], c["r"]
    C = np.array([[sd * sd, r * sd * sk], [r * sd * sk, sk * sk]])
    Ci = np.linalg.inv(C)
    dev = np.array(c["points"]) - np.array([c["d"]["value"], c["k"]["value"]])
    forms.append(np.einsum("ij,jk,ik->i", dev, Ci, dev))
result = {"ppf": stats.chi2.ppf(0.95, 2), "forms": forms}
`,
      cases,
    );
    expect(JOINT_95_RADIUS ** 2).toBeCloseTo(ref.ppf, 12);
    for (const forms of ref.forms) for (const q of forms) expect(q).toBeCloseTo(ref.ppf, 6);
  });

  it("dkRegionFigure draws the region, the profile valley and the line λ = √(D/k) through the estimate", () => {
    const c = dkRegionFigure(buildUpInput);
    const labels = c.data.datasets.map((d) => d.label);
    expect(labels).toEqual(expect.arrayContaining(["joint 95% region (from SEs and correlation)", "profile: D re-fitted at each k", "estimate"]));
    const lambdaLine = c.data.datasets.find((d) => (d.label ?? "").startsWith("λ = √(D/k)"));
    expect(lambdaLine).toBeDefined();
    // On the line, D/k equals λ̂² = D̂/k̂ (common practice, no source: a steady state fixes only this ratio).
    for (const p of lambdaLine!.data) expect(p.y / p.x).toBeCloseTo(1.3 / 2e-4, 0);
    const estimate = c.data.datasets.find((d) => d.label === "estimate")!;
    expect(estimate.data[0]).toEqual({ x: 2e-4, y: 1.3 });
  });

  it("dkRegionFigure leaves the region out when the fit gives no correlation", () => {
    const c = dkRegionFigure({ ...buildUpInput, correlation_D_k: null });
    expect(c.data.datasets.some((d) => d.label === "joint 95% region (from SEs and correlation)")).toBe(false);
  });
});
