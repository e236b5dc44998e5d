/** Round to `digits` significant figures, so numbers in figure configurations are short and stable. */
export function roundSignificant(v: number, digits = 6): number {
  if (!Number.isFinite(v) || v === 0) return v;
  return Number(v.toPrecision(digits));
}

/** A number as text with `digits` significant figures and no exponent for everyday magnitudes. */
export function formatNumber(v: number, digits = 3): string {
  if (!Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const magnitude = Math.floor(Math.log10(Math.abs(v)));
  const decimals = Math.max(0, digits - 1 - magnitude);
  return decimals > 8 ? v.toExponential(digits - 1) : v.toFixed(decimals);
}

/**
 * "96.3 ± 4.2 µm": the value to the precision its standard error supports
 * (two significant figures of the SE, as the command line prints it); the
 * value alone when there is no SE.
 */
export function formatWithError(value: number, se: number | null | undefined, unit = ""): string {
  const u = unit ? ` ${unit}` : "";
  if (se === null || se === undefined || !(se > 0) || !Number.isFinite(se)) return `${formatNumber(value)}${u}`;
  const decimals = Math.max(0, 1 - Math.floor(Math.log10(se)));
  return `${value.toFixed(decimals)} ± ${se.toFixed(decimals)}${u}`;
}

/** "[88.1, 104]": a confidence interval with three significant figures per end. */
export function formatInterval(ci: readonly [number, number] | null | undefined): string {
  return ci ? `[${formatNumber(ci[0])}, ${formatNumber(ci[1])}]` : "";
}

/** First letter upper-case, for titles built from axis labels. */
export function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
