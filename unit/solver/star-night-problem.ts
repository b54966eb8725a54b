import { ObservationRowsBuilder } from '../../core/solver/observation-rows.ts';
import type { SolverProblem } from '../../core/solver/problem.ts';
import { gaussian } from './random.ts';

export interface StarNightProblem {
  readonly problem: SolverProblem;
  /** Truth: globals [offset₀, motion₀, offset₁, motion₁, …], then locals [zero, flexure] per night. */
  readonly truthGlobal: Float64Array;
  readonly truthLocal: Float64Array;
  readonly sigma: number;
  /** Row numbers per night. */
  readonly nightRows: number[][];
}

/**
 * An invented declination-like problem: each star has an offset (partial 1) and a motion
 * (partial t in years), each night a zero point (partial 1) and a flexure-like term (partial
 * sin z). A common shift of every zero point against every star offset is exactly unobservable.
 * `rowsPerNight(n)` gives the stars seen on night n; `blunder` adds a gross error to given rows.
 */
export function starNightProblem(
  stars: number, nights: number, rowsPerNight: (night: number) => number, random: () => number,
  blunders: ReadonlyMap<number, number> = new Map(),
): StarNightProblem {
  const sigma = 0.2;
  const truthGlobal = Float64Array.from({ length: 2 * stars }, () => gaussian(random));
  const truthLocal = Float64Array.from({ length: 2 * nights }, () => gaussian(random));
  const builder = new ObservationRowsBuilder(nights * 20);
  const nightRows: number[][] = [];
  for (let night = 0; night < nights; night++) {
    const years = (night / nights) * 10 - 5;
    const rows: number[] = [];
    const count = rowsPerNight(night);
    const first = Math.floor(random() * stars);
    for (let i = 0; i < count; i++) {
      const star = (first + i) % stars;
      const sinZ = Math.sin((star / stars) * 1.2 - 0.6 + 0.05 * gaussian(random));
      let value = truthGlobal[2 * star] + years * truthGlobal[2 * star + 1]
        + truthLocal[2 * night] + sinZ * truthLocal[2 * night + 1] + sigma * gaussian(random);
      const k = builder.count;
      value += blunders.get(k) ?? 0;
      builder.beginRow(night, value, 1 / sigma ** 2);
      builder.addGlobal(2 * star, 1);
      builder.addGlobal(2 * star + 1, years);
      builder.addLocal(0, 1);
      builder.addLocal(1, sinZ);
      rows.push(k);
    }
    nightRows.push(rows);
  }
  const globalNames = Array.from({ length: 2 * stars }, (_, i) => `star ${i >> 1} ${i % 2 === 0 ? 'offset' : 'motion'}`);
  const problem: SolverProblem = {
    globalNames,
    blockLocalCount: new Int32Array(nights).fill(2),
    rows: builder.finish(),
    localName: (b, i) => `night ${b} ${i === 0 ? 'zero point' : 'flexure'}`,
  };
  return { problem, truthGlobal, truthLocal, sigma, nightRows };
}
