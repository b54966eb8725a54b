import { tridiagonalize, tridiagonalQl } from './symmetric-eigen.ts';

/** Every eigenvalue (ascending) and the eigenvectors of the lowest few (row j ↔ values[j]). */
export interface LowestEigenpairs {
  readonly values: Float64Array;
  /** count × n row-major: vectors[j·n + i] is component i of the unit eigenvector of values[j]. */
  readonly vectors: Float64Array;
}

const INVERSE_ITERATIONS = 3;

/**
 * All eigenvalues and the `count` lowest eigenvectors of a real symmetric n×n matrix (row-major,
 * not modified; `count` may be a function of the ascending eigenvalues),
 * for reports that list only the weakest directions: Householder tridiagonalisation
 * without accumulating Q (~n³ multiply-adds), implicit QL for the eigenvalues alone (O(n²)), then
 * inverse iteration on the tridiagonal for each wanted eigenvector, reorthogonalised against the
 * ones before it (which separates vectors of close or equal eigenvalues), and the stored reflectors
 * applied to bring it back (O(n²) each). About a ninth of a full decomposition's ~9n³.
 * Method: Golub & Van Loan, Matrix Computations, 4th ed., §8.3 (tridiagonalisation) and §8.2.2
 * (inverse iteration); tridiagonal solve by Gaussian elimination with partial pivoting (§4.3);
 * sections from memory. Accuracy: eigenvalues as symmetric-eigen.ts (n·ε·‖A‖); each vector's
 * residual ‖A·x − λ·x‖ ~ n·ε·‖A‖. Within an exactly repeated eigenvalue any orthonormal basis of
 * its eigenspace is as valid as another, so the vectors there may differ from symmetricEigen's.
 */
export function lowestEigenpairs(matrix: Float64Array, n: number, count: number | ((values: Float64Array) => number)): LowestEigenpairs {
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(matrix[i])) throw new Error(`lowestEigenpairs: element (${Math.floor(i / n)}, ${i % n}) is ${matrix[i]}; pass a finite matrix`);
  }
  const a = matrix.slice(0, n * n);
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  const reflectors = new Float64Array(n * n);
  if (n === 1) d[0] = a[0];
  else if (n > 1) tridiagonalize(a, n, null, d, e, reflectors);
  const diagonal = d.slice();
  const offDiagonal = e.slice();
  tridiagonalQl(d, e, n, null);
  const values = d.slice().sort();
  // `count` may depend on the eigenvalues (e.g. how many fall below a threshold).
  const wanted = Math.max(0, Math.min(typeof count === 'number' ? count : count(values), n));
  const vectors = new Float64Array(wanted * n);
  let norm = 0;
  for (let i = 0; i < n; i++) norm = Math.max(norm, Math.abs(diagonal[i]) + Math.abs(offDiagonal[i]) + (i > 0 ? Math.abs(offDiagonal[i - 1]) : 0));
  const solver = new ShiftedTridiagonal(diagonal, offDiagonal, n);
  // Vectors are iterated and reorthogonalised in the tridiagonal basis, then all brought back.
  for (let j = 0; j < wanted; j++) {
    const y = vectors.subarray(j * n, j * n + n);
    // A fixed, non-special start (the result must not depend on chance).
    for (let i = 0; i < n; i++) y[i] = 1 + 0.5 * Math.sin(1.7 * i + 0.3 * j + 1);
    solver.factor(values[j], Math.max(norm, Number.MIN_VALUE) * Number.EPSILON);
    for (let pass = 0; pass < INVERSE_ITERATIONS; pass++) {
      solver.solve(y);
      for (let previous = 0; previous < j; previous++) orthogonalise(y, vectors.subarray(previous * n, previous * n + n));
      normalise(y);
    }
  }
  for (let j = 0; j < wanted; j++) applyReflectors(reflectors, n, vectors.subarray(j * n, j * n + n));
  return { values, vectors };
}

function orthogonalise(y: Float64Array, against: Float64Array): void {
  let dot = 0;
  for (let i = 0; i < y.length; i++) dot += y[i] * against[i];
  for (let i = 0; i < y.length; i++) y[i] -= dot * against[i];
}

function normalise(y: Float64Array): void {
  let sum = 0;
  for (let i = 0; i < y.length; i++) sum += y[i] * y[i];
  const scale = sum > 0 ? 1 / Math.sqrt(sum) : 0;
  for (let i = 0; i < y.length; i++) y[i] *= scale;
}

/** x ← H₀·H₁·…·H_{n−3}·x with H_k = I − 2·v_k·v_kᵀ (v_k in row k of `reflectors`; a zero row is I). */
function applyReflectors(reflectors: Float64Array, n: number, x: Float64Array): void {
  for (let k = n - 3; k >= 0; k--) {
    const row = k * n;
    let dot = 0;
    for (let i = k + 1; i < n; i++) dot += reflectors[row + i] * x[i];
    if (dot === 0) continue;
    for (let i = k + 1; i < n; i++) x[i] -= 2 * dot * reflectors[row + i];
  }
}

/**
 * (T − σ·I)·x = b for the symmetric tridiagonal T (diagonal d, off-diagonal e) by Gaussian
 * elimination with partial pivoting, which leaves an upper factor with two superdiagonals
 * (Golub & Van Loan §4.3, band matrices; section from memory). Pivots smaller than `floor` are
 * raised to it, as inverse iteration needs: the shift is an eigenvalue, so T − σI is singular to
 * rounding and the huge solution is the eigenvector wanted.
 */
class ShiftedTridiagonal {
  private readonly lower: Float64Array;
  private readonly pivot: Float64Array;
  private readonly upper1: Float64Array;
  private readonly upper2: Float64Array;
  private readonly swapped: Uint8Array;

  constructor(private readonly d: Float64Array, private readonly e: Float64Array, private readonly n: number) {
    this.lower = new Float64Array(n);
    this.pivot = new Float64Array(n);
    this.upper1 = new Float64Array(n);
    this.upper2 = new Float64Array(n);
    this.swapped = new Uint8Array(n);
  }

  factor(shift: number, floor: number): void {
    const { d, e, n, lower, pivot, upper1, upper2, swapped } = this;
    for (let i = 0; i < n; i++) {
      pivot[i] = d[i] - shift;
      upper1[i] = i < n - 1 ? e[i] : 0;
      upper2[i] = 0;
    }
    for (let i = 0; i < n - 1; i++) {
      const below = e[i];
      if (Math.abs(pivot[i]) >= Math.abs(below)) {
        swapped[i] = 0;
        const factor = pivot[i] !== 0 ? below / pivot[i] : 0;
        lower[i] = factor;
        pivot[i + 1] -= factor * upper1[i];
      } else {
        swapped[i] = 1;
        const factor = pivot[i] / below;
        lower[i] = factor;
        pivot[i] = below;
        const keep = upper1[i];
        upper1[i] = pivot[i + 1];
        pivot[i + 1] = keep - factor * pivot[i + 1];
        if (i < n - 2) {
          upper2[i] = upper1[i + 1];
          upper1[i + 1] = -factor * upper1[i + 1];
        }
      }
    }
    for (let i = 0; i < n; i++) if (Math.abs(pivot[i]) < floor) pivot[i] = pivot[i] < 0 ? -floor : floor;
  }

  solve(b: Float64Array): void {
    const { n, lower, pivot, upper1, upper2, swapped } = this;
    for (let i = 0; i < n - 1; i++) {
      if (swapped[i]) {
        const top = b[i];
        b[i] = b[i + 1];
        b[i + 1] = top - lower[i] * b[i];
      } else {
        b[i + 1] -= lower[i] * b[i];
      }
    }
    for (let i = n - 1; i >= 0; i--) {
      let sum = b[i];
      if (i + 1 < n) sum -= upper1[i] * b[i + 1];
      if (i + 2 < n) sum -= upper2[i] * b[i + 2];
      b[i] = sum / pivot[i];
    }
    // Rescale between passes so repeated solves near a singular shift do not overflow.
    let largest = 0;
    for (let i = 0; i < n; i++) largest = Math.max(largest, Math.abs(b[i]));
    if (largest > 0 && Number.isFinite(largest)) for (let i = 0; i < n; i++) b[i] /= largest;
  }
}
