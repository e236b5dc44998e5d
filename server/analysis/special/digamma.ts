/**
 * The digamma function ψ(x) = d ln Γ(x)/dx for x > 0: the recurrence ψ(x) = ψ(x + 1) − 1/x
 * up to x ≥ 10, then the asymptotic series ln x − 1/(2x) − Σ B₂ₖ/(2k x^(2k)), accurate to about
 * 1e-14 there (the first omitted term, B₁₂/(12x¹²), is 2e-14 at x = 10). Source: Abramowitz & Stegun 1964, 6.3.5 and 6.3.18.
 */
export function digamma(x: number): number {
  if (!(x > 0)) throw new RangeError(`digamma: x must be > 0, got ${x}`);
  let shift = 0;
  while (x < 10) {
    shift -= 1 / x;
    x += 1;
  }
  const inv2 = 1 / (x * x);
  const series = inv2 * (1 / 12 - inv2 * (1 / 120 - inv2 * (1 / 252 - inv2 * (1 / 240 - inv2 * (1 / 132)))));
  return shift + Math.log(x) - 0.5 / x - series;
}
