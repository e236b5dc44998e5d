import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { fitGlobal, type GlobalFit } from "../../../server/analysis/fit/fitGlobal.ts";
import { fitProfile, type ProfileFit } from "../../../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

// Noise that grows with the intensity: SD = √(1 + (0.08·μ)²) a.u. (multiplicative plus additive).
function noisy(model: "exponential" | "power-free", theta: number[], amplitude: number, background: number, seed: number): { x: number[]; y: number[] } {
  const random = createRandom(seed);
  const x = positions(0, 300, 50);
  const mu = simulateProfile(model, x, theta, amplitude, background);
  return { x, y: mu.map((m) => m + Math.sqrt(1 + (0.08 * m) ** 2) * random.normal()) };
}

// Source: HC3 sandwich (J'J)^-1 J' diag(r²/(1-h)²) J (J'J)^-1 — White 1980, Econometrica;
// MacKinnon & White 1985, J Econometrics — evaluated by numpy on the Jacobian of the fitted model.
const HC3 = `
def hc3(J, r):
    B = np.linalg.inv(J.T @ J)
    h = np.einsum("ij,jk,ik->i", J, B, J)
    meat = J.T @ (J * (r / (1 - h))[:, None] ** 2)
    return B @ meat @ B
`;

describe("sandwichCovariance (HC3) against numpy on the same Jacobian and residuals", () => {
  it("power-free single fit (two nonlinear parameters): the full covariance to 1e-7 relative", async () => {
    const { x, y } = noisy("power-free", [40, 1.6], 150, 10, 11);
    const fit = fitProfile(x, y, FitOptions.parse({ model: "power-free", autoWindow: false, weights: "none" })) as ProfileFit;
    expect(fit.ok).toBe(true);
    expect(fit.errorModel).toBe("hc3");
    const reference = await runPython<number[][]>(
      HC3 +
        `
x = np.array(data["x"]); y = np.array(data["y"])
x0, m, A, B = data["x0"], data["m"], data["A"], data["B"]
g = (1 + x / x0) ** -m
J = np.stack([A * m * x / x0**2 * (1 + x / x0) ** (-m - 1), -A * np.log1p(x / x0) * g, g, np.ones_like(x)], axis=1)
result = hc3(J, y - A * g - B)
`,
      { x, y, x0: fit.parameters.x0Um.value, m: fit.parameters.exponent.value, A: fit.parameters.amplitude.value, B: fit.parameters.background.value },
    );
    expect(fit.covariance!.names).toEqual(["x0Um", "exponent", "amplitude", "background"]);
    for (let i = 0; i < 4; i++)
      for (let j = 0; j < 4; j++)
        expect(Math.abs(fit.covariance!.matrix[i][j] - reference[i][j])).toBeLessThan(1e-7 * Math.sqrt(Math.abs(reference[i][i] * reference[j][j])));
  });

  it("global exponential fit of three profiles: λ's variance and each profile's amplitude and background variances to 1e-7 relative", async () => {
    const profiles = [noisy("exponential", [55], 120, 15, 21), noisy("exponential", [55], 90, 25, 22), noisy("exponential", [55], 160, 8, 23)];
    const fit = fitGlobal(profiles, FitOptions.parse({ model: "exponential", autoWindow: false, weights: "none" })) as GlobalFit;
    expect(fit.ok).toBe(true);
    const lambda = fit.shared.lambdaUm.value;
    const reference = await runPython<number[][]>(
      HC3 +
        `
lam = data["lam"]; K = len(data["profiles"])
rows = []; res = []
for k, p in enumerate(data["profiles"]):
    x = np.array(p["x"]); y = np.array(p["y"]); A, B = p["A"], p["B"]
    g = np.exp(-x / lam)
    J = np.zeros((len(x), 1 + 2 * K))
    J[:, 0] = A * x / lam**2 * g; J[:, 1 + 2 * k] = g; J[:, 2 + 2 * k] = 1
    rows.append(J); res.append(y - A * g - B)
result = hc3(np.vstack(rows), np.concatenate(res))
`,
      { lam: lambda, profiles: profiles.map((p, k) => ({ ...p, A: fit.profiles[k].amplitude.value, B: fit.profiles[k].background.value })) },
    );
    expect(relativeDifference(fit.shared.lambdaUm.se! ** 2, reference[0][0])).toBeLessThan(1e-7);
    fit.profiles.forEach((p, k) => {
      expect(relativeDifference(p.amplitude.se! ** 2, reference[1 + 2 * k][1 + 2 * k])).toBeLessThan(1e-7);
      expect(relativeDifference(p.background.se! ** 2, reference[2 + 2 * k][2 + 2 * k])).toBeLessThan(1e-7);
    });
  });

  it("errorModel classic keeps s²(JᵀJ)⁻¹, which differs from HC3 under noise that grows with the intensity", () => {
    const { x, y } = noisy("exponential", [55], 120, 15, 31);
    const hc3 = fitProfile(x, y, FitOptions.parse({ autoWindow: false, weights: "none" })) as ProfileFit;
    const classic = fitProfile(x, y, FitOptions.parse({ autoWindow: false, weights: "none", errorModel: "classic" })) as ProfileFit;
    expect(classic.errorModel).toBe("classic");
    expect(classic.parameters.lambdaUm.value).toBeCloseTo(hc3.parameters.lambdaUm.value, 10);
    expect(relativeDifference(classic.parameters.lambdaUm.se!, hc3.parameters.lambdaUm.se!)).toBeGreaterThan(0.05);
  });
});
