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
 * the factor from choleskyInPlace. Cost n³/2 multiply-adds after forming L⁻¹ (n³/6).
 * `scratch` (≥ n² elements) avoids an allocation when called in a loop.
 */
export function choleskyInverse(factor: Float64Array, n: number, inverse: Float64Array, scratch?: Float64Array): void {
  // L⁻¹ by forward substitution, column by column, kept in a scratch lower triangle.
  const lInv = scratch && scratch.length >= n * n ? scratch : new Float64Array(n * n);
  lInv.fill(0, 0, n * n);
  for (let j = 0; j < n; j++) {
    lInv[j * n + j] = 1 / factor[j * n + j];
    for (let i = j + 1; i < n; i++) {
      let sum = 0;
      const row = i * n;
      for (let k = j; k < i; k++) sum -= factor[row + k] * lInv[k * n + j];
      lInv[row + j] = sum / factor[row + i];
    }
  }
  // (L⁻ᵀL⁻¹)_ij = Σ_{k ≥ max(i,j)} L⁻¹_ki L⁻¹_kj
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = 0;
      for (let k = i; k < n; k++) sum += lInv[k * n + i] * lInv[k * n + j];
      inverse[i * n + j] = sum;
      inverse[j * n + i] = sum;
    }
  }
}
