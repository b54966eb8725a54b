import { choleskyInPlace, choleskyInverse } from './cholesky.ts';
import { nullSpaceInverse } from './null-space-inverse.ts';
import type { DroppedDirection } from './null-space-inverse.ts';
import { symmetricEigen } from './symmetric-eigen.ts';

/**
 * Relative eigenvalue (of the unit-diagonal, "correlation-form" matrix) at or below which a
 * direction counts as singular and is dropped from a generalised inverse. Exact singularity
 * leaves eigenvalues of order n·ε ≈ 1e-15…1e-13; genuine but weak directions of real problems
 * stay above ~1e-10, so 1e-12 separates the two (common practice for double precision).
 */
export const SINGULAR_RELATIVE_EIGENVALUE = 1e-12;

export type { DroppedDirection } from './null-space-inverse.ts';

/** Above this size the singular case goes through nullSpaceInverse (~2n³) rather than a full eigen-decomposition (~10n³). */
const NULL_SPACE_ROUTE_MINIMUM = 24;

/**
 * Inverse of a symmetric positive semi-definite n×n matrix (row-major), written into `inverse`.
 * The matrix is scaled to unit diagonal (Jacobi scaling, which makes the pivot test independent
 * of parameter units), then inverted by Cholesky; if a pivot falls below
 * SINGULAR_RELATIVE_EIGENVALUE the scaled matrix is eigen-decomposed instead and directions with
 * relative eigenvalue at or below that threshold are dropped (for n ≥ 24 through
 * nullSpaceInverse, which needs only the dropped eigenvectors) — a generalised inverse that gives
 * the minimum-norm solution in scaled coordinates. Parameters with a zero diagonal (no
 * information at all) come out with zero rows and columns. Returns the dropped directions
 * (empty when Cholesky succeeded). `matrix` is not modified.
 */
/** Scratch reused across calls (the solver calls this once per block; single-threaded, not re-entrant). */
let scratch = { scale: new Float64Array(16), scaled: new Float64Array(256), factor: new Float64Array(256), lower: new Float64Array(256) };
const NO_DIRECTIONS: DroppedDirection[] = [];

export function symmetricGeneralisedInverse(matrix: Float64Array, n: number, inverse: Float64Array): DroppedDirection[] {
  if (scratch.scale.length < n) {
    scratch = { scale: new Float64Array(n), scaled: new Float64Array(n * n), factor: new Float64Array(n * n), lower: new Float64Array(n * n) };
  }
  const { scale, scaled, factor } = scratch;
  let hasEmpty = false;
  for (let i = 0; i < n; i++) {
    const diagonal = matrix[i * n + i];
    scale[i] = diagonal > 0 ? 1 / Math.sqrt(diagonal) : 0;
    if (scale[i] === 0) hasEmpty = true;
  }
  // choleskyInPlace tests each pivot against its own diagonal element, which is the same test as
  // on the unit-diagonal matrix, so the regular path needs no scaled copy.
  for (let i = 0; i < n * n; i++) factor[i] = matrix[i];
  if (!hasEmpty && choleskyInPlace(factor, n, SINGULAR_RELATIVE_EIGENVALUE)) {
    choleskyInverse(factor, n, inverse, scratch.lower);
    return NO_DIRECTIONS;
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) scaled[i * n + j] = matrix[i * n + j] * scale[i] * scale[j];
  }
  for (let i = 0; i < n; i++) if (scale[i] === 0) scaled[i * n + i] = 0;
  const viaNullSpace = n >= NULL_SPACE_ROUTE_MINIMUM ? nullSpaceInverse(scaled.subarray(0, n * n), n, SINGULAR_RELATIVE_EIGENVALUE, inverse) : null;
  if (viaNullSpace) {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) inverse[i * n + j] *= scale[i] * scale[j];
    return viaNullSpace;
  }
  const dropped: DroppedDirection[] = [];
  const { values, vectors } = symmetricEigen(scaled.subarray(0, n * n), n);
  const largest = Math.max(values[n - 1], Number.MIN_VALUE);
  inverse.fill(0, 0, n * n);
  for (let j = 0; j < n; j++) {
    const relative = values[j] / largest;
    const vector = vectors.subarray(j * n, j * n + n);
    if (relative <= SINGULAR_RELATIVE_EIGENVALUE) {
      dropped.push({ relativeEigenvalue: Math.max(relative, 0), vector: vector.slice() });
      continue;
    }
    const reciprocal = 1 / values[j];
    for (let r = 0; r < n; r++) {
      const vr = vector[r] * reciprocal;
      if (vr === 0) continue;
      for (let c = 0; c < n; c++) inverse[r * n + c] += vr * vector[c];
    }
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) inverse[i * n + j] *= scale[i] * scale[j];
  }
  return dropped;
}
