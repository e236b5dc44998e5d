/** Round to `digits` significant figures without exponent noise for everyday magnitudes. */
export function significant(v: number, digits = 3): string {
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return "0";
  const magnitude = Math.floor(Math.log10(Math.abs(v)));
  const decimals = Math.max(0, digits - 1 - magnitude);
  return decimals > 8 ? v.toExponential(digits - 1) : v.toFixed(decimals);
}

/**
 * "96 ± 4 µm [88, 104]": the value to the precision its standard error
 * supports (two significant figures of the SE), with the 95% interval.
 */
export function formatEstimate(e: { value: number; se: number | null; ci95: [number, number] | null } | null, unit = ""): string {
  if (!e) return "—";
  const u = unit ? ` ${unit}` : "";
  if (e.se === null || !(e.se > 0)) return `${significant(e.value)}${u}`;
  const decimals = Math.max(0, 1 - Math.floor(Math.log10(e.se)));
  const ci = e.ci95 ? ` [${e.ci95[0].toFixed(decimals)}, ${e.ci95[1].toFixed(decimals)}]` : "";
  return `${e.value.toFixed(decimals)} ± ${e.se.toFixed(decimals)}${u}${ci}`;
}
