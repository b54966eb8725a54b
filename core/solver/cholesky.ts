/**
 * Dense Cholesky factorisation A = L·Lᵀ of a symmetric positive definite n×n matrix stored
 * row-major in a Float64Array (only the lower triangle is read; L overwrites it, the strict upper
 * triangle is zeroed). Method: the row-oriented Cholesky–Banachiewicz scheme (Golub & Van Loan,
 * Matrix Computations, 4th ed., §4.2). Backward stable; relative accuracy of solves ≈ κ(A)·ε.
 *
 * Returns false (and leaves `a` partly overwritten) when a pivot falls to or below
 * `relativePivotFloor` times the original diagonal element of its row: the matrix is then
 * singular or too ill-conditioned to trust, and the caller must take its fallback path.
 */
export function choleskyInPlace(a: Float64Array, n: number, relativePivotFloor = 1e-12): boolean {
  for (let j = 0; j < n; j++) {
    const rowJ = j * n;
    const original = a[rowJ + j];
    let pivot = original;
    for (let k = 0; k < j; k++) pivot -= a[rowJ + k] * a[rowJ + k];
    if (!(pivot > relativePivotFloor * Math.abs(original)) || !(pivot > 0)) return false;
    const diagonal = Math.sqrt(pivot);
    a[rowJ + j] = diagonal;
    for (let i = j + 1; i < n; i++) {
      const rowI = i * n;
      let sum = a[rowI + j];
      for (let k = 0; k < j; k++) sum -= a[rowI + k] * a[rowJ + k];
      a[rowI + j] = sum / diagonal;
    }
    for (let k = j + 1; k < n; k++) a[rowJ + k] = 0;
  }
  return true;
}

/** Solves L·Lᵀ·x = b in place of b, given the factor from choleskyInPlace. */
export function choleskySolveInPlace(factor: Float64Array, n: number, b: Float64Array): void {
  for (let i = 0; i < n; i++) {
    const row = i * n;
    let sum = b[i];
    for (let k = 0; k < i; k++) sum -= factor[row + k] * b[k];
    b[i] = sum / factor[row + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let sum = b[i];
    for (let k = i + 1; k < n; k++) sum -= factor[k * n + i] * b[k];
    b[i] = sum / factor[i * n + i];
  }
}

/**
 * The full symmetric inverse (L·Lᵀ)⁻¹ = L⁻ᵀ·L⁻¹ written into `inverse` (n×n row-major), given
 * the factor from choleskyInPlace. Cost n³/6 for L⁻¹ plus n³/6 for the product, both arranged
 * to run along rows (row k of L⁻¹ scaled into the rows ≤ k), so memory is read in order even
 * when the matrix is far larger than the cache. `scratch` (≥ n² elements) avoids an allocation.
 */
export function choleskyInverse(factor: Float64Array, n: number, inverse: Float64Array, scratch?: Float64Array): void {
  // L⁻¹ row by row: row i = −(Σ_{k<i} L_ik·(row k of L⁻¹)) / L_ii, and 1/L_ii on the diagonal.
  const lInv = scratch && scratch.length >= n * n ? scratch : new Float64Array(n * n);
  lInv.fill(0, 0, n * n);
  for (let i = 0; i < n; i++) {
    const rowI = i * n;
    for (let k = 0; k < i; k++) {
      const lik = factor[rowI + k];
      if (lik === 0) continue;
      const rowK = k * n;
      for (let j = 0; j <= k; j++) lInv[rowI + j] += lik * lInv[rowK + j];
    }
    const diagonal = factor[rowI + i];
    for (let j = 0; j < i; j++) lInv[rowI + j] = -lInv[rowI + j] / diagonal;
    lInv[rowI + i] = 1 / diagonal;
  }
  // (L⁻ᵀL⁻¹)_ij = Σ_k L⁻¹_ki·L⁻¹_kj: each row k of L⁻¹ adds L⁻¹_ki·(row k) to row i, j ≤ i ≤ k.
  inverse.fill(0, 0, n * n);
  for (let k = 0; k < n; k++) {
    const rowK = k * n;
    for (let i = 0; i <= k; i++) {
      const a = lInv[rowK + i];
      if (a === 0) continue;
      const rowI = i * n;
      for (let j = 0; j <= i; j++) inverse[rowI + j] += a * lInv[rowK + j];
    }
  }
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) inverse[j * n + i] = inverse[i * n + j];
}
