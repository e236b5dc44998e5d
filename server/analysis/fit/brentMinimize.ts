export interface BrentMinimum {
  x: number;
  fx: number;
  evaluations: number;
}

/**
 * Minimum of a function of one variable on [a, b] by Brent's method:
 * golden-section steps safeguarding parabolic interpolation, no derivatives.
 * Stops when the bracket around the minimum is narrower than
 * 2·(relTol·|x| + absTol). Source: Brent 1973, Algorithms for Minimization
 * without Derivatives, ch. 5 (procedure localmin).
 */
export function brentMinimize(
  f: (x: number) => number,
  a: number,
  b: number,
  relTol = 1e-8,
  absTol = 1e-12,
  maxEvaluations = 200,
): BrentMinimum {
  if (!(a < b)) throw new RangeError(`brentMinimize: need a < b, got [${a}, ${b}]`);
  const golden = 0.5 * (3 - Math.sqrt(5));
  let lo = a;
  let hi = b;
  let x = lo + golden * (hi - lo);
  let w = x;
  let v = x;
  let fx = f(x);
  let fw = fx;
  let fv = fx;
  let evaluations = 1;
  let d = 0;
  let e = 0;
  while (evaluations < maxEvaluations) {
    const m = 0.5 * (lo + hi);
    const tol = relTol * Math.abs(x) + absTol;
    const t2 = 2 * tol;
    if (Math.abs(x - m) <= t2 - 0.5 * (hi - lo)) break;
    let useGolden = true;
    if (Math.abs(e) > tol) {
      // Parabola through (v, fv), (w, fw), (x, fx).
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (lo - x) && p < q * (hi - x)) {
        d = p / q;
        const u = x + d;
        if (u - lo < t2 || hi - u < t2) d = x < m ? tol : -tol;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = (x < m ? hi : lo) - x;
      d = golden * e;
    }
    const u = x + (Math.abs(d) >= tol ? d : d > 0 ? tol : -tol);
    const fu = f(u);
    evaluations++;
    if (fu <= fx) {
      if (u < x) hi = x;
      else lo = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) lo = u;
      else hi = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, fx, evaluations };
}
