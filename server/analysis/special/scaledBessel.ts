/**
 * Exponentially scaled modified Bessel functions of the first kind,
 * i0e(z) = e^(−z)·I0(z) and i1e(z) = e^(−z)·I1(z) for z ≥ 0: finite where I0
 * and I1 themselves overflow (z > ~710). Power series for z ≤ 20 (all terms
 * positive, no cancellation), the Hankel asymptotic expansion beyond, cut at
 * its smallest term. Source: Abramowitz & Stegun 1964, 9.6.10 and 9.7.1.
 */
export function i0e(z: number): number {
  return scaledBessel(0, z);
}

export function i1e(z: number): number {
  return scaledBessel(1, z);
}

function scaledBessel(order: 0 | 1, z: number): number {
  if (Number.isNaN(z)) return NaN;
  if (z < 0) throw new RangeError(`scaled Bessel function: z must be ≥ 0, got ${z}`);
  if (z <= 20) {
    const q = (z * z) / 4;
    let term = order === 0 ? 1 : z / 2;
    let sum = term;
    for (let k = 1; k < 200; k++) {
      term *= q / (k * (k + order));
      sum += term;
      if (term < 1e-17 * sum) break;
    }
    return sum * Math.exp(-z);
  }
  const mu = 4 * order * order;
  let term = 1;
  let sum = 1;
  for (let k = 1; k < 200; k++) {
    const next = (-term * (mu - (2 * k - 1) ** 2)) / (k * 8 * z);
    if (Math.abs(next) >= Math.abs(term)) break;
    term = next;
    sum += term;
    if (Math.abs(term) < 1e-17 * Math.abs(sum)) break;
  }
  return sum / Math.sqrt(2 * Math.PI * z);
}
