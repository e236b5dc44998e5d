import { describe, expect, it } from "vitest";
import { globalFromJob, globalFromStored } from "../../client/views/fits/globalFitView.ts";

// common practice, no source: the two API shapes of a global fit (job result, stored analysis) show the same numbers.
describe("globalFitView", () => {
  const lambda = { value: 89.26, se: 0.26, ci95: [88.75, 89.77] as [number, number] };

  it("globalFromJob and globalFromStored read the same global fit to the same view", () => {
    const fromJob = globalFromJob({
      analysis_id: 1,
      genotype: "wt",
      channel: "glm",
      model: "exponential",
      status: "converged",
      message: "Converged",
      n_embryos: 30,
      lambda_um: lambda,
      per_embryo: { parameter: "lambdaUm", fitted: 30, failed: 0, mean_um: 89.2, sd_um: 5.8, median_um: 89.0, sem_um: 1.06, mean_over_global: 0.9996 },
      note: "spread note",
      akaike_weight: null,
    });
    const fromStored = globalFromStored({
      id: 1,
      selection: { genotype: "wt", channel: "glm" },
      settings: { model: "exponential" },
      result: {
        fit: { status: "converged", message: "Converged", shared: { lambdaUm: lambda } },
        summary: { fitted: 30, failed: 0, meanUm: 89.2, sdUm: 5.8, medianUm: 89.0, semUm: 1.06, meanOverGlobal: 0.9996, note: "spread note" },
      },
    });
    expect(fromStored).toEqual(fromJob);
    expect(fromJob.perEmbryo?.sdUm).toBe(5.8);
  });

  it("globalFromStored of a failed global fit has no λ and no per-embryo summary", () => {
    const v = globalFromStored({ id: 7, selection: {}, settings: { model: "power" }, result: { fit: { status: "failed", message: "did not converge" }, summary: null } });
    expect(v).toMatchObject({ analysisId: 7, lambdaUm: null, perEmbryo: null, status: "failed", genotype: "" });
  });
});
