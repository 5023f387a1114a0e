/**
 * Solves (T + mu I) d = rhs for a symmetric tridiagonal T (diag, off) by the Thomas algorithm.
 * Returns null when a pivot is not positive, i.e. the shifted matrix is not positive definite.
 */
export function solveTridiagonal(diag: readonly number[], off: readonly number[], rhs: readonly number[], mu: number): number[] | null {
  const n = diag.length;
  const c = new Array<number>(n).fill(0);
  const z = new Array<number>(n).fill(0);
  let pivot = diag[0] + mu;
  if (!(pivot > 0)) return null;
  z[0] = rhs[0] / pivot;
  for (let i = 1; i < n; i++) {
    c[i - 1] = off[i - 1] / pivot;
    pivot = diag[i] + mu - off[i - 1] * c[i - 1];
    if (!(pivot > 0)) return null;
    z[i] = (rhs[i] - off[i - 1] * z[i - 1]) / pivot;
  }
  const d = z.slice();
  for (let i = n - 2; i >= 0; i--) d[i] -= c[i] * d[i + 1];
  return d;
}
