/** Dense row-major matrix of plain numbers; small sizes only (parameters, channels). */
export type Matrix = number[][];

export function zeros(rows: number, cols: number): Matrix {
  return Array.from({ length: rows }, () => new Array<number>(cols).fill(0));
}

export function identity(n: number): Matrix {
  const m = zeros(n, n);
  for (let i = 0; i < n; i++) m[i][i] = 1;
  return m;
}

export function transpose(a: Matrix): Matrix {
  if (a.length === 0) return [];
  const out = zeros(a[0].length, a.length);
  for (let i = 0; i < a.length; i++) for (let j = 0; j < a[0].length; j++) out[j][i] = a[i][j];
  return out;
}

export function multiply(a: Matrix, b: Matrix): Matrix {
  const n = a.length;
  const k = b.length;
  const m = b[0]?.length ?? 0;
  if ((a[0]?.length ?? 0) !== k) throw new RangeError(`multiply: shapes ${n}×${a[0]?.length} and ${k}×${m} do not match`);
  const out = zeros(n, m);
  for (let i = 0; i < n; i++)
    for (let p = 0; p < k; p++) {
      const aip = a[i][p];
      if (aip === 0) continue;
      for (let j = 0; j < m; j++) out[i][j] += aip * b[p][j];
    }
  return out;
}

export function multiplyVector(a: Matrix, v: ArrayLike<number>): number[] {
  return a.map((row) => {
    let s = 0;
    for (let j = 0; j < row.length; j++) s += row[j] * v[j];
    return s;
  });
}

/** JᵀJ for a Jacobian stored column-wise (one Float64Array per parameter). */
export function gramFromColumns(columns: ArrayLike<number>[]): Matrix {
  const p = columns.length;
  const g = zeros(p, p);
  for (let i = 0; i < p; i++)
    for (let j = i; j < p; j++) {
      const ci = columns[i];
      const cj = columns[j];
      let s = 0;
      for (let r = 0; r < ci.length; r++) s += ci[r] * cj[r];
      g[i][j] = s;
      g[j][i] = s;
    }
  return g;
}
