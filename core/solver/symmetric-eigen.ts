/**
 * Eigen-decomposition of a real symmetric n×n matrix (row-major Float64Array, not modified):
 * Householder reduction to tridiagonal form followed by the implicit QL iteration with
 * Wilkinson-type shifts (Wilkinson & Reinsch, Handbook for Automatic Computation II, 1971,
 * procedures tred2/tql2; Press et al., Numerical Recipes, 3rd ed., §11.3–11.4; sections from memory).
 * Accuracy: eigenvalues to about n·ε·‖A‖ absolute, eigenvectors orthonormal to ~n·ε.
 * Cost about 9n³ flops (tridiagonalisation with vectors ~ 4n³/3 + 2n³, QL ~ 6n³ at most).
 *
 * Returns eigenvalues ascending and `vectors` with eigenvector j in row j (vectors[j*n + i]).
 * Throws if the QL iteration fails to converge in 60 sweeps for one eigenvalue (does not happen
 * for finite input; a NaN in the matrix is reported instead).
 */
export interface SymmetricEigen {
  readonly values: Float64Array;
  readonly vectors: Float64Array;
}

/**
 * Householder reduction of the symmetric `a` (overwritten) to tridiagonal (d, e). With `qt` it
 * accumulates Qᵀ (A = Q·T·Qᵀ); only the lower triangle of `a` is read and kept up to date; with `reflectors` it stores reflector k's unit vector v in row k
 * (zero rows for skipped steps), so that Q·y = H₀·H₁·…·H_{n−3}·y can be applied later.
 */
export function tridiagonalize(
  a: Float64Array, n: number, qt: Float64Array | null, d: Float64Array, e: Float64Array, reflectors: Float64Array | null = null,
): void {
  const v = new Float64Array(n);
  const p = new Float64Array(n);
  for (let k = 0; k < n - 2; k++) {
    // Householder vector for column k below the diagonal.
    let norm2 = 0;
    for (let i = k + 1; i < n; i++) norm2 += a[i * n + k] * a[i * n + k];
    const x0 = a[(k + 1) * n + k];
    const alpha = x0 >= 0 ? -Math.sqrt(norm2) : Math.sqrt(norm2);
    const vNorm2 = norm2 - x0 * x0 + (x0 - alpha) * (x0 - alpha);
    if (norm2 === 0 || vNorm2 === 0) continue;
    const scale = 1 / Math.sqrt(vNorm2);
    for (let i = 0; i <= k; i++) v[i] = 0;
    v[k + 1] = (x0 - alpha) * scale;
    for (let i = k + 2; i < n; i++) v[i] = a[i * n + k] * scale;
    // A ← H A H with H = I − 2vvᵀ: p = A v, K = vᵀp, w = 2p − 2Kv, A −= v wᵀ + w vᵀ, on the
    // lower triangle of the trailing block only (rows and columns k+1…; v is zero above): each
    // element (i, j < i) read once serves p_i and p_j, and the update touches half the matrix.
    for (let i = k + 1; i < n; i++) p[i] = 0;
    for (let i = k + 1; i < n; i++) {
      const row = i * n;
      const vi = v[i];
      let sum = a[row + i] * vi;
      for (let j = k + 1; j < i; j++) {
        const aij = a[row + j];
        sum += aij * v[j];
        p[j] += aij * vi;
      }
      p[i] += sum;
    }
    let kappa = 0;
    for (let i = k + 1; i < n; i++) kappa += v[i] * p[i];
    if (reflectors) for (let i = k + 1; i < n; i++) reflectors[k * n + i] = v[i];
    for (let i = k + 1; i < n; i++) p[i] = 2 * p[i] - 2 * kappa * v[i];
    for (let i = k + 1; i < n; i++) {
      const row = i * n;
      const vi = v[i];
      const pi = p[i];
      for (let j = k + 1; j <= i; j++) a[row + j] -= vi * p[j] + pi * v[j];
    }
    // Column k below the diagonal becomes (α, 0, …, 0): what H does to it by construction.
    a[(k + 1) * n + k] = alpha;
    for (let i = k + 2; i < n; i++) a[i * n + k] = 0;
    // Qᵀ ← H Qᵀ: rows k+1.. of Qᵀ change by −2 v (vᵀ Qᵀ).
    if (!qt) continue;
    for (let j = 0; j < n; j++) p[j] = 0;
    for (let i = k + 1; i < n; i++) {
      const vi = v[i];
      if (vi === 0) continue;
      const row = i * n;
      for (let j = 0; j < n; j++) p[j] += vi * qt[row + j];
    }
    for (let i = k + 1; i < n; i++) {
      const vi2 = 2 * v[i];
      if (vi2 === 0) continue;
      const row = i * n;
      for (let j = 0; j < n; j++) qt[row + j] -= vi2 * p[j];
    }
  }
  for (let i = 0; i < n; i++) d[i] = a[i * n + i];
  for (let i = 0; i < n - 1; i++) e[i] = a[(i + 1) * n + i];
  e[n - 1] = 0;
}

function rotateRows(z: Float64Array, n: number, i: number, s: number, c: number): void {
  const r0 = i * n;
  const r1 = (i + 1) * n;
  for (let k = 0; k < n; k++) {
    const f = z[r1 + k];
    const g = z[r0 + k];
    z[r1 + k] = s * g + c * f;
    z[r0 + k] = c * g - s * f;
  }
}

/** Implicit QL on the tridiagonal (d, e), e[i] coupling i and i+1; rotations applied to rows of z (none when null: eigenvalues only, O(n²)). */
export function tridiagonalQl(d: Float64Array, e: Float64Array, n: number, z: Float64Array | null): void {
  for (let l = 0; l < n; l++) {
    let iterations = 0;
    let m: number;
    do {
      for (m = l; m < n - 1; m++) {
        const dd = Math.abs(d[m]) + Math.abs(d[m + 1]);
        if (Math.abs(e[m]) <= Number.EPSILON * dd) break;
      }
      if (m === l) break;
      if (iterations++ === 60) throw new Error(`symmetricEigen: QL iteration did not converge for eigenvalue ${l}`);
      let g = (d[l + 1] - d[l]) / (2 * e[l]);
      let r = Math.hypot(g, 1);
      g = d[m] - d[l] + e[l] / (g + (g >= 0 ? r : -r));
      let s = 1;
      let c = 1;
      let p = 0;
      let i: number;
      let underflow = false;
      for (i = m - 1; i >= l; i--) {
        const f = s * e[i];
        const b = c * e[i];
        r = Math.hypot(f, g);
        e[i + 1] = r;
        if (r === 0) {
          d[i + 1] -= p;
          e[m] = 0;
          underflow = true;
          break;
        }
        s = f / r;
        c = g / r;
        g = d[i + 1] - p;
        r = (d[i] - g) * s + 2 * c * b;
        p = s * r;
        d[i + 1] = g + p;
        g = c * r - b;
        if (z) rotateRows(z, n, i, s, c);
      }
      if (underflow) continue;
      d[l] -= p;
      e[l] = g;
      e[m] = 0;
    } while (m !== l);
  }
}

export function symmetricEigen(matrix: Float64Array, n: number): SymmetricEigen {
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(matrix[i])) {
      throw new Error(`symmetricEigen: element (${Math.floor(i / n)}, ${i % n}) is ${matrix[i]}; pass a finite matrix`);
    }
  }
  const a = matrix.slice(0, n * n);
  const qt = new Float64Array(n * n);
  for (let i = 0; i < n; i++) qt[i * n + i] = 1;
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  if (n === 1) {
    d[0] = a[0];
  } else {
    tridiagonalize(a, n, qt, d, e);
    tridiagonalQl(d, e, n, qt);
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((x, y) => d[x] - d[y]);
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  order.forEach((from, to) => {
    values[to] = d[from];
    vectors.set(qt.subarray(from * n, from * n + n), to * n);
  });
  return { values, vectors };
}
