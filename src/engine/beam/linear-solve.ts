/**
 * Dense linear solve by Gaussian elimination with partial pivoting, for the small systems of a
 * statically indeterminate member (reactions, reaction couples, two integration constants).
 */

/**
 * Solves A x = b in place. A is row-major n x n, b has length n and receives x.
 * @param a - matrix, destroyed
 * @param b - right-hand side, overwritten with the solution
 * @param n - size
 * @param pivotTolerance - a pivot of magnitude at or below this times the largest entry of A
 *   means the system is singular (or too ill-conditioned to trust)
 * @returns true when solved, false when singular
 */
export function solveInPlace(a: Float64Array, b: Float64Array, n: number, pivotTolerance: number): boolean {
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a[i]));
  const tiny = pivotTolerance * scale;
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * n + k]);
      if (v > best) {
        best = v;
        p = i;
      }
    }
    if (!(best > tiny)) return false;
    if (p !== k) {
      for (let j = k; j < n; j++) {
        const t = a[k * n + j];
        a[k * n + j] = a[p * n + j];
        a[p * n + j] = t;
      }
      const t = b[k];
      b[k] = b[p];
      b[p] = t;
    }
    const pivot = a[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = a[i * n + k] / pivot;
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) a[i * n + j] -= f * a[k * n + j];
      b[i] -= f * b[k];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let j = i + 1; j < n; j++) s -= a[i * n + j] * b[j];
    b[i] = s / a[i * n + i];
  }
  return true;
}
