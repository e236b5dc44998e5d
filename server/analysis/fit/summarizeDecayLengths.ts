import { mean, median, standardDeviation } from "../stats/descriptive.ts";
import type { GlobalFitResult } from "./fitGlobal.ts";
import type { FitResult } from "./fitProfile.ts";
import type { ParameterEstimate } from "./parameterEstimate.ts";

export interface DecayLengthSummary {
  /** The length-scale parameter summarised: "lambdaUm" (or "x0Um" for power laws). */
  parameter: string;
  /** Profiles whose own fit gave a value, and those whose fit did not. */
  fitted: number;
  failed: number;
  /** Mean, SD (n − 1), median and SEM of the per-embryo values (µm); null when too few. */
  meanUm: number | null;
  sdUm: number | null;
  medianUm: number | null;
  semUm: number | null;
  /** The shared value from the global fit, when one was given and succeeded. */
  global: ParameterEstimate | null;
  /** Mean of per-embryo values divided by the global value. */
  meanOverGlobal: number | null;
  /** How to read the two side by side. */
  note: string;
}

/**
 * Per-embryo decay lengths (each profile fitted alone) summarised next to the
 * shared decay length of a global fit. The two answer different questions:
 * the SD across embryos includes real embryo-to-embryo variation, whereas
 * the global fit's standard error assumes one λ for all and reflects
 * measurement noise only. Common practice, no source.
 */
export function summarizeDecayLengths(fits: readonly FitResult[], global: GlobalFitResult | null = null, parameter = "lambdaUm"): DecayLengthSummary {
  const values = fits.flatMap((f) => (f.ok && f.parameters[parameter] ? [f.parameters[parameter].value] : []));
  const failed = fits.length - values.length;
  const m = values.length > 0 ? mean(values) : null;
  const sd = values.length > 1 ? standardDeviation(values) : null;
  const globalEstimate = global !== null && global.ok ? (global.shared[parameter] ?? null) : null;
  const spreadNote =
    sd !== null && globalEstimate?.se != null && values.length > 2 && sd > 3 * globalEstimate.se * Math.sqrt(values.length)
      ? " Here the spread across embryos is much larger than the global fit's uncertainty allows for noise alone, so λ likely varies between embryos; report the per-embryo spread."
      : "";
  return {
    parameter,
    fitted: values.length,
    failed,
    meanUm: m,
    sdUm: sd,
    medianUm: values.length > 0 ? median(values) : null,
    semUm: sd !== null ? sd / Math.sqrt(values.length) : null,
    global: globalEstimate,
    meanOverGlobal: m !== null && globalEstimate !== null ? m / globalEstimate.value : null,
    note:
      "Per-embryo values vary with real embryo-to-embryo differences as well as noise; the global value assumes one decay length for all embryos." +
      spreadNote,
  };
}
