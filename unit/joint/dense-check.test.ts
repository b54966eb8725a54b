// Independent check of the block elimination: the same linearised joint problem (rows and priors
// from buildJointProblem) solved as one dense weighted least-squares system with a plain Gaussian
// elimination written here, textbook normal equations (e.g. Press et al., Numerical Recipes,
// §15.4, from memory). Estimates must agree to 1e-9 relative.
import { describe, expect, it } from 'vitest';
import { buildJointProblem } from '../../core/joint/build-joint-problem.ts';
import { fillObservationFactors } from '../../core/joint/observation-factors.ts';
import { reduceArchive } from '../../core/joint/reduce-archive.ts';
import { jointSolve, type SolverProblem } from '../../core/solver/index.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { DEG } from '../../core/units.ts';
import { modelFor, simulatedInputs, TIME_SCALE } from './joint-helpers.ts';

function denseSolve(problem: SolverProblem): Float64Array {
  const nGlobal = problem.globalNames.length;
  const offset = [nGlobal];
  for (const c of problem.blockLocalCount) offset.push(offset[offset.length - 1] + c);
  const n = offset[offset.length - 1];
  const normal = new Float64Array(n * n), rhs = new Float64Array(n);
  const addRow = (columns: number[], values: number[], residual: number, weight: number): void => {
    for (let i = 0; i < columns.length; i++) {
      rhs[columns[i]] += weight * values[i] * residual;
      for (let j = 0; j < columns.length; j++) normal[columns[i] * n + columns[j]] += weight * values[i] * values[j];
    }
  };
  const r = problem.rows;
  for (let k = 0; k < r.count; k++) {
    const columns: number[] = [], values: number[] = [];
    for (let t = r.globalStart[k]; t < r.globalStart[k + 1]; t++) { columns.push(r.globalIndex[t]); values.push(r.globalPartial[t]); }
    for (let t = r.localStart[k]; t < r.localStart[k + 1]; t++) { columns.push(offset[r.block[k]] + r.localIndex[t]); values.push(r.localPartial[t]); }
    addRow(columns, values, r.residual[k], r.weight[k]);
  }
  for (const p of problem.priors ?? []) {
    const column = p.parameter.kind === 'global' ? p.parameter.index : offset[p.parameter.block] + p.parameter.index;
    addRow([column], [1], p.value, 1 / p.sigma ** 2);
  }
  // Gaussian elimination with partial pivoting.
  for (let c = 0; c < n; c++) {
    let pivot = c;
    for (let i = c + 1; i < n; i++) if (Math.abs(normal[i * n + c]) > Math.abs(normal[pivot * n + c])) pivot = i;
    for (let j = 0; j < n; j++) [normal[c * n + j], normal[pivot * n + j]] = [normal[pivot * n + j], normal[c * n + j]];
    [rhs[c], rhs[pivot]] = [rhs[pivot], rhs[c]];
    for (let i = c + 1; i < n; i++) {
      const f = normal[i * n + c] / normal[c * n + c];
      if (f === 0) continue;
      for (let j = c; j < n; j++) normal[i * n + j] -= f * normal[c * n + j];
      rhs[i] -= f * rhs[c];
    }
  }
  const x = new Float64Array(n);
  for (let i = n - 1; i >= 0; i--) {
    let s = rhs[i];
    for (let j = i + 1; j < n; j++) s -= normal[i * n + j] * x[j];
    x[i] = s / normal[i * n + i];
  }
  return x;
}

describe('joint problem: block elimination vs a dense solve', () => {
  it('buildJointProblem + jointSolve (one weighted pass) equals the dense normal-equation solution to 1e-9 relative', async () => {
    const { archive, inputs } = await simulatedInputs({ seed: 77, years: 1, starCount: 5, nightsPerYearTarget: 30, blunderRate: 0 });
    const model = modelFor(archive, { robustIterations: 1 });
    const reduced = await reduceArchive(inputs, model, TIME_SCALE, UNCONTROLLED);
    const s = inputs.site.site;
    fillObservationFactors(reduced.observations, inputs.stars, { latitudeRad: s.latitudeDeg * DEG, longitudeRad: s.longitudeDeg * DEG, heightM: s.heightM }, TIME_SCALE);
    const { problem } = buildJointProblem(model, inputs.stars, reduced.nights, reduced.observations);
    expect(problem.constraints).toEqual([]);
    const block = jointSolve(problem, { robust: false });
    const dense = denseSolve(problem);
    const nGlobal = problem.globalNames.length;
    let largest = 0;
    for (let i = 0; i < dense.length; i++) largest = Math.max(largest, Math.abs(dense[i]));
    for (let i = 0; i < nGlobal; i++) {
      expect(Math.abs(block.globalEstimate[i] - dense[i]), problem.globalNames[i]).toBeLessThan(1e-9 * Math.max(Math.abs(dense[i]), 1e-3 * largest));
    }
    for (let i = 0; i < block.localEstimate.length; i++) {
      expect(Math.abs(block.localEstimate[i] - dense[nGlobal + i]), `local ${i}`).toBeLessThan(1e-9 * Math.max(Math.abs(dense[nGlobal + i]), 1e-3 * largest));
    }
    console.log(`dense check: ${nGlobal} globals, ${block.localEstimate.length} locals, ${problem.rows.count} rows`);
  }, 60_000);
});
