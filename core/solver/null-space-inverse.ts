import { choleskyInPlace, choleskyInverse } from './cholesky.ts';
import { lowestEigenpairs } from './lowest-eigenpairs.ts';

/** A direction dropped from a generalised inverse, in the scaled (unit-diagonal) coordinates. */
export interface DroppedDirection {
  /** Eigenvalue of the scaled matrix divided by its largest eigenvalue. */
  readonly relativeEigenvalue: number;
  /** Unit eigenvector over the matrix's n parameters (scaled coordinates). */
  readonly vector: Float64Array;
}

/**
 * The minimum-norm generalised inverse of a singular symmetric positive semi-definite matrix S
 * (n×n row-major, unit diagonal or zero rows) without its full eigen-decomposition: all
 * eigenvalues and the eigenvectors V of those at or below `threshold`·λmax (lowest-eigenpairs.ts,
 * ~n³), then S⁺ = (S + V·Vᵀ)⁻¹ − V·Vᵀ by Cholesky (~n³): S + V·Vᵀ has the same eigenvectors,
 * with 1 + λ in place of the dropped λ, so it is regular, and subtracting V·Vᵀ leaves
 * Σ_kept v·vᵀ/λ (a standard identity for the pseudo-inverse of a symmetric matrix; e.g. Ben-Israel
 * & Greville, Generalized Inverses, 2nd ed., 2003, ch. 1; from memory) with an error of about
 * λ_dropped ≤ threshold·λmax on the dropped directions. About 2n³ against ~10n³ for the
 * eigen-decomposition route. Writes `inverse`; returns the dropped directions, or null when
 * S + V·Vᵀ still fails Cholesky (eigenvalues crowding the threshold), for the caller's fallback.
 */
export function nullSpaceInverse(scaled: Float64Array, n: number, threshold: number, inverse: Float64Array): DroppedDirection[] | null {
  let largest = Number.MIN_VALUE;
  let dropped = 0;
  const { values, vectors } = lowestEigenpairs(scaled, n, (ascending) => {
    largest = Math.max(ascending[n - 1], Number.MIN_VALUE);
    while (dropped < n && ascending[dropped] / largest <= threshold) dropped++;
    return dropped;
  });
  const shifted = scaled.slice(0, n * n);
  addOuterProducts(shifted, vectors, n, dropped, 1);
  if (!choleskyInPlace(shifted, n, 1e-15)) return null;
  choleskyInverse(shifted, n, inverse);
  addOuterProducts(inverse, vectors, n, dropped, -1);
  return Array.from({ length: dropped }, (_, j) => ({
    relativeEigenvalue: Math.max(values[j] / largest, 0),
    vector: vectors.slice(j * n, j * n + n),
  }));
}

/** matrix += sign·Σ_j v_j·v_jᵀ over the first `count` rows v_j of `vectors`. */
function addOuterProducts(matrix: Float64Array, vectors: Float64Array, n: number, count: number, sign: number): void {
  for (let j = 0; j < count; j++) {
    const base = j * n;
    for (let r = 0; r < n; r++) {
      const vr = sign * vectors[base + r];
      if (vr === 0) continue;
      const row = r * n;
      for (let c = 0; c < n; c++) matrix[row + c] += vr * vectors[base + c];
    }
  }
}
