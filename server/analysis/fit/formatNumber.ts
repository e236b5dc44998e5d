/** A number for messages: four significant digits, no trailing zeros. */
export function formatNumber(v: number): string {
  return Number.isFinite(v) ? Number(v.toPrecision(4)).toString() : String(v);
}
