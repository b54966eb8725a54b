import type { PreparedProblem } from './prepared-problem.ts';
import type { ParameterPrior } from './problem.ts';
import { SINGULAR_RELATIVE_EIGENVALUE } from './small-inverse.ts';
import { lowestEigenpairs } from './lowest-eigenpairs.ts';

/**
 * Relative eigenvalue below which a direction is reported as weak: condition index
 * √(λmax/λ) above 30, the level Belsley, Kuh & Welsch (Regression Diagnostics, 1980, §3.3; section from memory) take
 * as a strong near-dependency (λ/λmax < 1/900).
 */
export const WEAK_RELATIVE_EIGENVALUE = 1 / 900;
/** Coefficients smaller than this (in a unit eigenvector) are left out of the listing. */
const LISTED_COEFFICIENT = 0.05;
/** A constraint or prior whose unit row projects on a direction by more than this resolves it. */
const RESOLVING_PROJECTION = 0.1;

export interface WeakDirection {
  /** Eigenvalue of the correlation-form matrix over its largest one. */
  readonly relativeEigenvalue: number;
  readonly status: 'singular' | 'weak' | 'determined';
  /**
   * The combination Σ coefficient·(correction/scale) the data constrain least, as (name,
   * coefficient) pairs sorted by |coefficient|, largest first and positive; coefficients are the
   * unit eigenvector in scaled coordinates (each parameter divided by its √diag⁻¹ scale), so they
   * compare across units. Coefficients below 0.05 are left out.
   */
  readonly combination: readonly { readonly name: string; readonly coefficient: number }[];
  /** Labels of the constraints and priors that fix this direction (empty: none does). */
  readonly resolvedBy: readonly string[];
  /** What the solver did with it: left to the data, fixed by constraint/prior, or minimum norm. */
  readonly resolution: 'data' | 'constraint' | 'minimum-norm';
}

export interface DegeneracyReport {
  /**
   * Eigenvalues (ascending) of the reduced global normal matrix of the free globals — blocks
   * eliminated, blocks' own priors included, global priors and constraints not — scaled to unit
   * diagonal (correlation form).
   */
  readonly eigenvalues: Float64Array;
  /** λmax/λmin, with λmin floored at ε·λmax so that it stays finite. */
  readonly conditionNumber: number;
  readonly weakest: readonly WeakDirection[];
  /** Blocks whose local matrix was singular, with the combination dropped (minimum norm). */
  readonly singularBlocks: readonly { readonly block: number; readonly combination: readonly { name: string; coefficient: number }[] }[];
  readonly singularBlockCount: number;
}

function listCombination(vector: Float64Array, name: (i: number) => string): { name: string; coefficient: number }[] {
  let largest = 0;
  for (let i = 0; i < vector.length; i++) if (Math.abs(vector[i]) > Math.abs(largest)) largest = vector[i];
  const sign = largest < 0 ? -1 : 1;
  const out: { name: string; coefficient: number }[] = [];
  for (let i = 0; i < vector.length; i++) {
    if (Math.abs(vector[i]) >= LISTED_COEFFICIENT) out.push({ name: name(i), coefficient: sign * vector[i] });
  }
  return out.sort((a, b) => Math.abs(b.coefficient) - Math.abs(a.coefficient));
}

/** Unit rows (scaled coordinates over the free globals) of every constraint and global prior, with labels. */
function resolverRows(
  prep: PreparedProblem, free: Int32Array, scale: Float64Array, localRows: Float64Array,
  priors: readonly ParameterPrior[], globalNames: readonly string[],
): { label: string; row: Float64Array }[] {
  const n = prep.globalCount;
  const out: { label: string; row: Float64Array }[] = [];
  const add = (label: string, dense: (g: number) => number): void => {
    const row = Float64Array.from(free, (g, i) => dense(g) / scale[i]);
    const norm = Math.hypot(...row);
    if (norm > 0) out.push({ label, row: row.map((x) => x / norm) });
  };
  prep.localConstraints.forEach((c, i) => add(c.label, (g) => localRows[i * n + g]));
  for (const c of prep.globalConstraints) {
    const dense = new Float64Array(n);
    c.globalIndex.forEach((g, j) => { dense[g] += c.globalCoefficient[j]; });
    add(c.label, (g) => dense[g]);
  }
  priors.forEach((p) => {
    if (p.parameter.kind !== 'global') return;
    const index = p.parameter.index;
    add(`prior on ${globalNames[index]}`, (g) => (g === index ? 1 : 0));
  });
  return out;
}

/**
 * Eigen-analysis of the reduced global system (see DegeneracyReport). `reducedNormal` is the
 * n×n reduced matrix, `localConstraintRows` the constraints' effective rows on the globals (B).
 * Cost ~f³ for f free globals (all eigenvalues, eigenvectors of the weakest only: lowest-eigenpairs.ts).
 */
export function degeneracyReport(
  prep: PreparedProblem, reducedNormal: Float64Array, localConstraintRows: Float64Array,
  globalNames: readonly string[], priors: readonly ParameterPrior[], weakCount: number,
  singularBlocks: readonly { block: number; vectors: readonly Float64Array[] }[], localName: (block: number, index: number) => string,
): DegeneracyReport {
  const n = prep.globalCount;
  const free = Int32Array.from({ length: n }, (_, i) => i).filter((g) => !prep.globalFixed[g]);
  const f = free.length;
  const scale = Float64Array.from(free, (g) => Math.sqrt(Math.max(reducedNormal[g * n + g], 0)));
  const scaled = new Float64Array(f * f);
  for (let i = 0; i < f; i++) {
    for (let j = 0; j < f; j++) {
      const denominator = scale[i] * scale[j];
      scaled[i * f + j] = denominator > 0 ? reducedNormal[free[i] * n + free[j]] / denominator : 0;
    }
  }
  const { values, vectors } = lowestEigenpairs(scaled, f, Math.min(weakCount, f));
  const largest = f > 0 ? Math.max(values[f - 1], Number.MIN_VALUE) : 1;
  const resolvers = resolverRows(prep, free, scale.map((s) => (s > 0 ? 1 / s : 1)), localConstraintRows, priors, globalNames);
  const weakest: WeakDirection[] = [];
  for (let j = 0; j < Math.min(weakCount, f); j++) {
    const vector = vectors.subarray(j * f, j * f + f);
    const relative = Math.max(values[j], 0) / largest;
    const status = relative <= SINGULAR_RELATIVE_EIGENVALUE ? 'singular' : relative <= WEAK_RELATIVE_EIGENVALUE ? 'weak' : 'determined';
    const resolvedBy = resolvers
      .filter((r) => Math.abs(r.row.reduce((s, x, i) => s + x * vector[i], 0)) > RESOLVING_PROJECTION)
      .map((r) => r.label);
    weakest.push({
      relativeEigenvalue: relative, status,
      combination: listCombination(vector, (i) => globalNames[free[i]]),
      resolvedBy,
      resolution: status === 'determined' ? 'data' : resolvedBy.length > 0 ? 'constraint' : status === 'singular' ? 'minimum-norm' : 'data',
    });
  }
  return {
    eigenvalues: values,
    conditionNumber: f > 0 ? largest / Math.max(values[0], Number.EPSILON * largest) : 1,
    weakest,
    singularBlocks: singularBlocks.slice(0, 20).map((b) => ({
      block: b.block,
      combination: listCombination(b.vectors[0], (i) => localName(b.block, i)),
    })),
    singularBlockCount: singularBlocks.length,
  };
}
