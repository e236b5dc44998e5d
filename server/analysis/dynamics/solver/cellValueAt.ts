/**
 * Value at position x (µm) from cell averages on a uniform grid of cell width
 * h: linear between cell centres, extended linearly over the half cells at
 * either end (second order, like the finite volumes themselves).
 */
export function cellValueAt(c: ArrayLike<number>, xUm: number, cellWidthUm: number): number {
  const n = c.length;
  const pos = Math.min(Math.max(xUm / cellWidthUm - 0.5, -0.5), n - 0.5);
  const j = Math.min(Math.max(Math.floor(pos), 0), n - 2);
  const f = pos - j;
  return c[j] * (1 - f) + c[j + 1] * f;
}
