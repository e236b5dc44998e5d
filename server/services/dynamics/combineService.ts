import { getAnalysis, listAnalyses, storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { loadProfiles } from "../../../db/profiles.ts";
import { kineticsWithDiffusion, steadyStateCaveat, type KineticQuantities } from "../../analysis/derived.ts";
import type { GlobalFitResult } from "../../analysis/fit/fitGlobal.ts";
import { tQuantile95 } from "../../analysis/fit/tQuantile95.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import type { CombineRequest } from "./dynamicsRequests.ts";
import { emptyQuantities, est, frapCaveat, type DynamicsQuantities, type EstimateJson } from "./dynamicsJson.ts";
import type { FrapJson } from "./frapService.ts";

export interface CombineJson extends DynamicsQuantities {
  analysis_id: number;
  frap_analysis_id: number;
  global_fit_analysis_id: number;
  genotype: string;
  channel: string;
  model: string;
  n_embryos: number;
  /** j0 = A·D/λ (exponential; finite: ·tanh(L/λ)); units of the intensities × µm/s. */
  source_flux: (EstimateJson & { unit: string }) | null;
  amplitude: EstimateJson;
  method: string[];
  caveat: string;
}

/**
 * k = D/λ², half-life, j0 and τ(x) from a FRAP D and the steady-state λ of a
 * stored global fit, with delta-method uncertainties (server/analysis/derived.ts).
 * The amplitude for j0 is the mean of the embryos' fitted amplitudes with
 * SE = SD/√n (their covariance with λ is not carried: it is small next to the
 * embryo-to-embryo spread).
 */
export function combineFrapWithFit(db: Db, request: CombineRequest): CombineJson {
  const frap = getAnalysis(db, request.frapAnalysisId);
  if (!frap || frap.kind !== "frap")
    throw new UserError("not-found", `--frap ${request.frapAnalysisId}: no stored FRAP analysis has this id (run \`morphogauge frap FILE…\` and use the id it prints)`, { status: 404 });
  const frapResult = frap.result as Omit<FrapJson, "analysis_id">;
  const d = frapResult.D_um2_per_s;
  if (!d) throw new UserError("no-diffusion", `FRAP analysis ${frap.id} has no fitted D (no curve could be fitted)`);
  const candidates = listAnalyses(db, "global-fit").filter((a) => {
    const sel = a.selection as { genotype?: string; channel?: string };
    const model = (a.settings as { model?: string }).model;
    return sel.genotype === request.genotype && (request.channel === undefined || sel.channel === request.channel) && (request.model === undefined ? ["exponential", "finite", "source"].includes(model ?? "") : model === request.model);
  });
  if (candidates.length === 0)
    throw new UserError(
      "not-found",
      `--fit ${request.genotype}: no stored global fit of an SDD model (exponential, finite or source) for genotype "${request.genotype}"${request.channel ? `, channel "${request.channel}"` : ""}; run \`morphogauge fit --genotype ${request.genotype} --global\` first`,
      { status: 404 },
    );
  const preferred = candidates.find((a) => (a.settings as { model: string }).model === "exponential") ?? candidates[0];
  const stored = getAnalysis(db, preferred.id)!;
  const model = (stored.settings as { model: "exponential" | "finite" | "source" }).model;
  const { fit } = stored.result as { fit: GlobalFitResult };
  const channel = (stored.selection as { channel: string }).channel;
  if (!fit.ok || !fit.shared.lambdaUm) throw new UserError("fit-failed", `the stored global fit ${stored.id} did not succeed (${fit.message}); refit the group first`);
  const lambda = fit.shared.lambdaUm;
  const amplitudes = fit.profiles.map((p) => p.amplitude.value);
  const nA = amplitudes.length;
  const meanA = amplitudes.reduce((a, b) => a + b, 0) / nA;
  const seA = nA > 1 ? Math.sqrt(amplitudes.reduce((a, b) => a + (b - meanA) ** 2, 0) / (nA - 1) / nA) : (fit.profiles[0].amplitude.se ?? null);
  let lengthUm: number | null = null;
  if (model === "finite") {
    const lengths = loadProfiles(db, { profileIds: stored.profileIds }).map((p) => p.lengthUm).filter((l): l is number => l !== null);
    if (lengths.length === 0) throw new UserError("no-length", `the finite model needs the embryo length for j0, and the embryos of global fit ${stored.id} have none`);
    lengthUm = lengths.reduce((a, b) => a + b, 0) / lengths.length;
  }
  const positions = request.accumulationPositionsUm ?? [0, 1, 2, 3].map((m) => m * lambda.value);
  const kin: KineticQuantities = kineticsWithDiffusion({
    model,
    lambdaUm: lambda,
    amplitude: { value: meanA, se: seA, ci95: null },
    covarianceLambdaAmplitude: 0,
    lengthUm,
    diffusion: { valueUm2PerS: d.value, seUm2PerS: d.se },
    accumulationPositionsUm: positions,
  });
  const tA = nA > 1 ? tQuantile95(nA - 1) : 1.959963984540054;
  const result = {
    ...emptyQuantities(),
    frap_analysis_id: frap.id,
    global_fit_analysis_id: stored.id,
    genotype: request.genotype,
    channel,
    model,
    n_embryos: nA,
    D_um2_per_s: d,
    mobile_fraction: frapResult.mobile_fraction,
    half_time_s: frapResult.half_time_s,
    lambda_um: est(lambda),
    k_per_s: est(kin.degradationPerS),
    half_life_s: est(kin.halfLifeS),
    accumulation_time_s: kin.accumulationTimes.map((a) => ({ x_um: a.positionUm, ...est(a.timeS)! })),
    source_flux: kin.sourceFlux ? { ...est(kin.sourceFlux)!, unit: "intensity units·µm/s (calibrated only if the profiles were)" } : null,
    amplitude: { value: meanA, se: seA, ci95: seA === null ? null : ([meanA - tA * seA, meanA + tA * seA] as [number, number]) },
    method: [
      "k = D/λ², half-life = ln2/k, j0 = A·D/λ" + (model === "finite" ? "·tanh(L/λ)" : "") + ", τ(x) = (1 + x/λ)/(2k)" + (model === "exponential" ? "" : " (τ(x) only for the exponential model)"),
      "uncertainties by the delta method with D (FRAP) and λ (global fit) independent; intervals on the log scale",
    ],
    caveat: `${frapCaveat} ${steadyStateCaveat}`,
  };
  const id = storeAnalysis(db, {
    kind: "combine",
    selection: { frapAnalysisId: frap.id, globalFitAnalysisId: stored.id, genotype: request.genotype, channel },
    settings: { model, accumulationPositionsUm: positions },
    engineVersion: ENGINE_VERSION,
    result,
    profileIds: stored.profileIds,
  });
  return { analysis_id: id, ...result };
}
