// Per-call cost of the time and Earth-orientation functions a per-night context needs.
// Run alone: `npx tsx unit/bench/earth.bench.ts`; or call runEarthBench() from unit/bench/run.ts.
// Each figure is the median over 31 batches of the mean time per call within a batch.
import os from 'node:os';
import { nutation00a, nutation00b, nutation06a, nutation06aAtSteps } from '../../core/earth/nutation-series.ts';
import { biasPrecessionNutationMatrix06 } from '../../core/earth/precession-06.ts';
import { gast06 } from '../../core/earth/sidereal-time.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';

export interface EarthBenchResult {
  readonly name: string;
  readonly medianMicroseconds: number;
}

function medianPerCall(name: string, callsPerBatch: number, call: (k: number) => unknown): EarthBenchResult {
  let sink = 0;
  const perBatch: number[] = [];
  for (let batch = 0; batch < 36; batch++) {
    const start = performance.now();
    for (let k = 0; k < callsPerBatch; k++) sink += call(batch * callsPerBatch + k) === undefined ? 1 : 0;
    const elapsed = performance.now() - start;
    if (batch >= 5) perBatch.push((elapsed * 1000) / callsPerBatch); // first 5 batches warm the JIT
  }
  perBatch.sort((a, b) => a - b);
  if (sink < 0) throw new Error('unreachable: keeps the calls observable');
  return { name, medianMicroseconds: perBatch[perBatch.length >> 1] };
}

/** Median per-call times in µs of nutation00a/06a/00b, the NPB matrix, GAST and TimeScale.fromUtc. */
export function runEarthBench(): EarthBenchResult[] {
  const tt = (k: number) => ({ jd1: 2451545.0, jd2: 9000 + k * 0.37 });
  const scale = new TimeScale(BUNDLED_LEAP_SECONDS);
  const nutation = nutation06a(tt(0));
  const samples = new Float64Array(10);
  return [
    medianPerCall('nutation00a', 200, (k) => nutation00a(tt(k))),
    medianPerCall('nutation06a', 200, (k) => nutation06a(tt(k))),
    medianPerCall('nutation00b', 2000, (k) => nutation00b(tt(k))),
    medianPerCall('nutation06aAtSteps (five instants of a night)', 200, (k) => nutation06aAtSteps(tt(k), 0.25, samples)),
    medianPerCall('biasPrecessionNutationMatrix06 (given nutation)', 5000, (k) => biasPrecessionNutationMatrix06(tt(k), nutation)),
    medianPerCall('gast06 (given nutation)', 5000, (k) => gast06(tt(k), tt(k), nutation)),
    medianPerCall('TimeScale.fromUtc (no EOP)', 5000, (k) => scale.fromUtc({ jd1: 2460000.5, jd2: k * 0.001 })),
  ];
}

/** The `npm run bench` entry: prints the median per-call time of each Earth-orientation routine. */
export async function run(): Promise<void> {
  console.log(`   machine load (1/5/15 min) ${os.loadavg().map((v) => v.toFixed(2)).join(' ')} on ${os.availableParallelism()} cores`);
  for (const result of runEarthBench()) console.log(`   ${result.name.padEnd(50)} ${result.medianMicroseconds.toFixed(2)} µs per call (median)`);
}

if (process.argv[1] !== undefined && import.meta.url.endsWith(process.argv[1].split('/').pop() ?? '')) {
  await run();
}
