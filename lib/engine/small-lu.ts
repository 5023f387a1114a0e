/**
 * LU factorisation with partial pivoting of a small dense matrix stored row-major in a Float64Array,
 * in place. Hand-written rather than ml-matrix's LuDecomposition because the stiff integrator factors
 * one n x n matrix (n <= ~12) per step, and allocating matrix objects per step costs more than the
 * arithmetic (bench/stiff-ode.bench.ts measures both).
 */

/** Factors a (n x n) in place into L (unit lower, below the diagonal) and U; false when singular. */
export function luFactor(a: Float64Array, n: number, pivots: Int32Array): boolean {
  for (let col = 0; col < n; col++) {
    let p = col;
    let best = Math.abs(a[col * n + col]);
    for (let r = col + 1; r < n; r++) {
      const v = Math.abs(a[r * n + col]);
      if (v > best) {
        best = v;
        p = r;
      }
    }
    pivots[col] = p;
    if (best === 0 || !Number.isFinite(best)) return false;
    if (p !== col) {
      for (let j = 0; j < n; j++) {
        const tmp = a[col * n + j];
        a[col * n + j] = a[p * n + j];
        a[p * n + j] = tmp;
      }
    }
    const inv = 1 / a[col * n + col];
    for (let r = col + 1; r < n; r++) {
      const l = a[r * n + col] * inv;
      a[r * n + col] = l;
      if (l !== 0) for (let j = col + 1; j < n; j++) a[r * n + j] -= l * a[col * n + j];
    }
  }
  return true;
}

/** Solves A x = b in place (b becomes x) with the factors from luFactor. */
export function luSolve(lu: Float64Array, n: number, pivots: Int32Array, b: Float64Array): void {
  for (let i = 0; i < n; i++) {
    const p = pivots[i];
    if (p !== i) {
      const tmp = b[i];
      b[i] = b[p];
      b[p] = tmp;
    }
  }
  for (let i = 1; i < n; i++) {
    let s = b[i];
    for (let j = 0; j < i; j++) s -= lu[i * n + j] * b[j];
    b[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let j = i + 1; j < n; j++) s -= lu[i * n + j] * b[j];
    b[i] = s / lu[i * n + i];
  }
}
