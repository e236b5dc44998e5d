/**
 * Decimal places at which to show an uncertainty and the value it belongs to
 * (negative: round to tens, hundreds…). The uncertainty keeps two significant
 * digits when its three leading digits are 100–354, one when 355–949, and is
 * rounded up to 1000 with two digits when 950–999; the value is then shown
 * to the same place. Source: Particle Data Group, Review of Particle Physics,
 * Introduction, "Rounding" (the convention most physics and biophysics journals follow).
 * Returns null for a missing, zero or non-finite uncertainty.
 */
export function uncertaintyDecimals(uncertainty: number | null | undefined): number | null {
  if (uncertainty === null || uncertainty === undefined || !Number.isFinite(uncertainty) || uncertainty <= 0) return null;
  const exponent = Math.floor(Math.log10(uncertainty));
  let leading = Math.round(uncertainty / 10 ** (exponent - 2));
  let e = exponent;
  // Floating point can land 99.999… on 1000 or 0.99… on 99.
  if (leading >= 1000) {
    leading = Math.round(leading / 10);
    e += 1;
  } else if (leading < 100) {
    leading *= 10;
    e -= 1;
  }
  // 950–999 rounds up to 1000 with two digits, which lands on the same place as one digit of 355–949.
  return leading <= 354 ? 1 - e : 0 - e;
}
