// Nightly reduction benchmark (core/reduction/NIGHT.md) on an invented simulated archive
// (core/simulate: one year, 120 stars and a fixed zenith camera with 20 stars): every night of every
// instrument reduced by reduceObservingNight with the inputs reduceArchive gives it, timed per
// pass; the simulation and the folder parsing are excluded. Prints the median over the passes
// and the load average; asserts nothing about time.
// Run alone: `npx tsx unit/bench/reduction.bench.ts [passes]`; profile with
// `node --import tsx --cpu-prof unit/bench/reduction.bench.ts`.
import { loadavg } from 'node:os';
import { realpathSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { encodeFolderFiles, writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import { nightKey, readSolveInputs } from '../../core/joint/solve-inputs.ts';
import type { SolveInputs } from '../../core/joint/solve-inputs.ts';
import { defaultNightConfiguration } from '../../core/reduction/night-inputs.ts';
import type { NightReductionInput } from '../../core/reduction/night-inputs.ts';
import { reduceObservingNight } from '../../core/reduction/reduce-observing-night.ts';
import { simulateArchive } from '../../core/simulate/simulate-archive.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import type { TransitLogRow } from '../../core/formats/transit-log.ts';

const REQUEST = { seed: 7, years: 1, starCount: 120, nightsPerYearTarget: 250, blunderRate: 0.002, zenithCameraStarCount: 20 };

/** The night inputs as reduceArchive (core/joint) builds them: clock from comparisons, b at the level's mean, the rest default. */
export function nightInputs(inputs: SolveInputs, timeScale: TimeScale): NightReductionInput[] {
  const groups = new Map<string, { mjd: number; instrumentId: string; rows: TransitLogRow[] }>();
  const defaultInstrument = inputs.site.instruments[0]?.id ?? '';
  for (const row of inputs.transits) {
    if (row.nightDateMjd === null) continue;
    const instrumentId = row.instrumentId ?? defaultInstrument;
    const key = nightKey(row.nightDateMjd, instrumentId);
    const group = groups.get(key) ?? { mjd: row.nightDateMjd, instrumentId, rows: [] };
    group.rows.push(row);
    groups.set(key, group);
  }
  const out: NightReductionInput[] = [];
  for (const group of groups.values()) {
    const instrument = inputs.site.instruments.find((i) => i.id === group.instrumentId);
    if (instrument === undefined) continue;
    const record = inputs.nights.get(nightKey(group.mjd, group.instrumentId));
    const comparisons = inputs.comparisons.filter((c) => c.nightDateMjd === group.mjd && (c.instrumentId === null || c.instrumentId === group.instrumentId));
    const level = record?.levelReadings ?? [];
    const levelMean = level.length > 0 ? level.reduce((s, r) => s + r.levelArcsec, 0) / level.length : 0;
    const weather = record?.weather ? { temperatureC: record.weather.temperatureC, pressureHpa: record.weather.pressureHpa, humidityPercent: record.weather.relativeHumidityPercent } : null;
    out.push({
      site: inputs.site.site, instrument, nightDateMjd: group.mjd, stars: inputs.stars, transits: group.rows, clockComparisons: comparisons,
      levelReadings: null, collimatorReadings: null, weather, previous: null, flexureArcsec: 0,
      configuration: { ...defaultNightConfiguration(comparisons.length > 0, false), levelArcsec: { mode: 'fixed', value: levelMean } },
      instantFromUtc: (utc) => timeScale.fromUtc(utc),
    });
  }
  return out;
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

export async function run(): Promise<void> {
  const passArgument = Number(process.argv.slice(2).find((a) => /^\d+$/.test(a)) ?? 3);
  const archive = await simulateArchive(REQUEST);
  const { inputs } = readSolveInputs(encodeFolderFiles(writeArchiveFolder(archive, archive.truth)));
  if (inputs === null) throw new Error('the simulated folder is not readable');
  const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS);
  const nights = nightInputs(inputs, timeScale);
  const transits = nights.reduce((s, n) => s + n.transits.length, 0);
  const wallS: number[] = [], cpuS: number[] = [];
  let refused = 0;
  for (let pass = 0; pass < passArgument; pass++) {
    const start = performance.now(), cpuStart = process.cpuUsage();
    refused = 0;
    for (const night of nights) if (!(await reduceObservingNight(night, UNCONTROLLED)).ok) refused++;
    const cpu = process.cpuUsage(cpuStart);
    wallS.push((performance.now() - start) / 1000);
    cpuS.push((cpu.user + cpu.system) / 1e6);
  }
  const cpu = median(cpuS);
  console.log(`   nightly reductions: ${nights.length} nights, ${transits} transits (${refused} nights refused), median of ${passArgument} passes: `
    + `wall ${median(wallS).toFixed(2)} s, CPU ${cpu.toFixed(2)} s = ${((cpu / transits) * 1e6).toFixed(0)} µs a transit, ${((cpu / nights.length) * 1e3).toFixed(1)} ms a night; `
    + `load ${loadavg().map((x) => x.toFixed(1)).join('/')}`);
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(realpathSync(process.argv[1])).href) await run();
