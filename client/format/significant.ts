/** Typographic minus sign, so negative numbers line up with the plus in "±". */
export const MINUS = "\u2212";

const SUPERSCRIPT: Record<string, string> = { "-": "\u207b", "0": "\u2070", "1": "\u00b9", "2": "\u00b2", "3": "\u00b3", "4": "\u2074", "5": "\u2075", "6": "\u2076", "7": "\u2077", "8": "\u2078", "9": "\u2079" };

/** "10⁻⁵" for exponent −5. */
export function powerOfTen(exponent: number): string {
  return "10" + [...String(exponent)].map((c) => SUPERSCRIPT[c] ?? c).join("");
}

/** Fixed-point text with `decimals` places (negative: round to tens, hundreds…), with a real minus sign. */
export function fixed(value: number, decimals: number): string {
  const d = Math.max(0, decimals);
  const step = decimals < 0 ? 10 ** -decimals : 1;
  const rounded = decimals < 0 ? Math.round(value / step) * step : value;
  const text = rounded.toFixed(d);
  // "-0.0" reads as a sign where there is none.
  if (/^-0(\.0+)?$/.test(text)) return text.slice(1);
  return text.replace("-", MINUS);
}

/** Numbers between these magnitudes print as plain decimals; others in powers of ten. */
const PLAIN_MIN = 1e-3;
const PLAIN_MAX = 1e6;

/** Whether `value` is best shown in scientific notation. */
export function needsExponent(value: number): boolean {
  const a = Math.abs(value);
  return a !== 0 && (a < PLAIN_MIN || a >= PLAIN_MAX);
}

/**
 * `value` with `digits` significant figures: 89.4603 → "89.5", 8003.1 → "8000",
 * 0.0000123 → "1.23 × 10⁻⁵". Not-a-number and missing values give "—".
 */
export function formatSignificant(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "\u2014";
  if (value === 0) return "0";
  if (needsExponent(value)) {
    const exponent = Math.floor(Math.log10(Math.abs(value)));
    let mantissa = Number((value / 10 ** exponent).toPrecision(digits));
    let e = exponent;
    if (Math.abs(mantissa) >= 10) {
      mantissa /= 10;
      e += 1;
    }
    return `${fixed(mantissa, digits - 1)} \u00d7 ${powerOfTen(e)}`;
  }
  const rounded = Number(value.toPrecision(digits));
  const magnitude = Math.floor(Math.log10(Math.abs(rounded)));
  return fixed(rounded, digits - 1 - magnitude);
}

/**
 * A number as the user typed or stored it (a dosage, a threshold, an age):
 * no trailing zeros, at most `maxDigits` significant figures to hide
 * floating-point noise such as 148.99999999.
 */
export function formatPlain(value: number | null | undefined, maxDigits = 6): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "\u2014";
  if (needsExponent(value)) return formatSignificant(value, maxDigits).replace(/\.?0+ ×/, " ×");
  const text = String(Number(value.toPrecision(maxDigits)));
  return text.replace("-", MINUS);
}
