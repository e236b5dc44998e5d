import { fixed, formatSignificant, needsExponent, powerOfTen } from "./significant.ts";
import { uncertaintyDecimals } from "./uncertaintyDecimals.ts";

/** An estimate as the API returns it. */
export interface EstimateLike {
  value: number | null;
  se?: number | null;
  ci95?: [number, number] | null;
}

/** Text for a unit after a number: "µm" → " µm", "" → "". */
function unitSuffix(unit: string): string {
  return unit ? ` ${unit}` : "";
}

/** The place to round an estimate to: from its SE, else from its CI half-width, else 3 significant figures. */
function roundingPlace(est: EstimateLike): number | null {
  const fromSe = uncertaintyDecimals(est.se ?? null);
  if (fromSe !== null) return fromSe;
  if (est.ci95 && Number.isFinite(est.ci95[0]) && Number.isFinite(est.ci95[1])) {
    // Half of a 95% CI is about two standard errors; rounding on it keeps one digit more than needed at worst.
    return uncertaintyDecimals(Math.abs(est.ci95[1] - est.ci95[0]) / 4);
  }
  return null;
}

/** "[87.4, 91.5]" at the given place. */
export function formatInterval(ci: [number, number] | null | undefined, decimals: number | null, unit = ""): string {
  if (!ci || !Number.isFinite(ci[0]) || !Number.isFinite(ci[1])) return "\u2014";
  const f = (x: number) => (decimals === null ? formatSignificant(x) : fixed(x, decimals));
  return `[${f(ci[0])}, ${f(ci[1])}]${unitSuffix(unit)}`;
}

/**
 * "89.5 ± 1.0 µm", rounded by its standard error; with `ci`, "89.5 ± 1.0 µm [87.4, 91.5]".
 * Very large or small values share one power of ten: "(1.23 ± 0.05) × 10⁻⁵ s".
 */
export function formatEstimate(est: EstimateLike | null | undefined, unit = "", options: { ci?: boolean } = {}): string {
  if (!est || est.value === null || !Number.isFinite(est.value)) return "\u2014";
  const place = roundingPlace(est);
  const hasSe = est.se !== null && est.se !== undefined && Number.isFinite(est.se) && est.se > 0;
  if (needsExponent(est.value)) {
    const exponent = Math.floor(Math.log10(Math.abs(est.value)));
    const scale = 10 ** exponent;
    const scaled: EstimateLike = {
      value: est.value / scale,
      se: hasSe ? est.se! / scale : null,
      ci95: est.ci95 ? [est.ci95[0] / scale, est.ci95[1] / scale] : null,
    };
    const inner = formatEstimate(scaled, "", { ci: false });
    const body = hasSe ? `(${inner}) \u00d7 ${powerOfTen(exponent)}` : `${inner} \u00d7 ${powerOfTen(exponent)}`;
    const ci = options.ci && scaled.ci95 ? ` ${formatInterval(scaled.ci95, roundingPlace(scaled))} \u00d7 ${powerOfTen(exponent)}` : "";
    return body + unitSuffix(unit) + ci;
  }
  const value = place === null ? formatSignificant(est.value) : fixed(est.value, place);
  const se = hasSe && place !== null ? ` \u00b1 ${fixed(est.se!, place)}` : "";
  const ci = options.ci && est.ci95 ? ` ${formatInterval(est.ci95, place)}` : "";
  return `${value}${se}${unitSuffix(unit)}${ci}`;
}

/** A value rounded like its estimate but without the ±: for table cells that show the CI in their own column. */
export function formatEstimateValue(est: EstimateLike | null | undefined): string {
  if (!est || est.value === null || !Number.isFinite(est.value)) return "\u2014";
  const place = roundingPlace(est);
  return place === null || needsExponent(est.value) ? formatSignificant(est.value) : fixed(est.value, place);
}

/** The CI of an estimate at the estimate's own rounding place. */
export function formatEstimateInterval(est: EstimateLike | null | undefined, unit = ""): string {
  if (!est) return "\u2014";
  return formatInterval(est.ci95 ?? null, needsExponent(est.value ?? 0) ? null : roundingPlace(est), unit);
}

