import { encodeFolderFiles, writeArchiveFolder, type ArchiveContent } from '../../core/archive-folder/archive-folder.ts';
import { keyedByCatalogueId } from '../store/keyedByCatalogueId.ts';
import { nightKey, readSolveInputs, type SolveInputs } from '../../core/joint/solve-inputs.ts';
import type { NightRecord } from '../../core/archive/records.ts';
import { defaultNightConfiguration, type NightReductionInput } from '../../core/reduction/night-inputs.ts';
import { reduceObservingNight } from '../../core/reduction/reduce-observing-night.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import type { TimeScale } from '../../core/time/timescale.ts';
import type { TransitLogRow } from '../../core/formats/transit-log.ts';
import { failedQuality, qualityOfReduction, type AprioriPrecision, type NightQuality } from './nightQuality.ts';

/** What one pass over some nights needs: the time scale, the a priori precision and each night's change key. */
export interface StoredNightContext {
  readonly timeScale: TimeScale;
  readonly apriori: AprioriPrecision;
  readonly keys: ReadonlyMap<string, string>;
}

/**
 * The nightly reduction's input for one stored night, configured as `meridian-ledger night
 * --archive` does (main/cli/commands/night.ts): clock from the night's comparisons when the log
 * is on a clock and has them (offset free and rate 0 otherwise), b fixed at the mean of the
 * night's level readings (0 without), a, c and the zenith zero free, the night's weather as the
 * fallback, no flexure.
 */
function reductionInput(inputs: SolveInputs, night: NightRecord, rows: readonly TransitLogRow[], timeScale: TimeScale): NightReductionInput | string {
  const instrument = inputs.site.instruments.find((i) => i.id === night.instrumentId);
  if (instrument === undefined) return `instrument ${night.instrumentId} is not among the site's instruments`;
  const mjd = rows[0].nightDateMjd ?? 0;
  const comparisons = inputs.comparisons.filter((c) => c.nightDateMjd === mjd && (c.instrumentId ?? instrument.id) === instrument.id);
  const isClockLog = rows.some((r) => r.times.kind === 'clock');
  const base = defaultNightConfiguration(isClockLog && comparisons.length > 0, false);
  const level = night.levelReadings;
  const configuration = level.length === 0 ? base : { ...base, levelArcsec: { mode: 'fixed' as const, value: level.reduce((s, r) => s + r.levelArcsec, 0) / level.length } };
  const w = night.weather;
  return {
    site: inputs.site.site, instrument, nightDateMjd: mjd, stars: inputs.stars, transits: rows, clockComparisons: comparisons,
    levelReadings: null, collimatorReadings: null, weather: w === null ? null : { temperatureC: w.temperatureC, pressureHpa: w.pressureHpa, humidityPercent: w.relativeHumidityPercent },
    configuration, previous: null, flexureArcsec: 0, instantFromUtc: (utc) => timeScale.fromUtc(utc),
  };
}

/** Reduces one night read back from the folder, or says why it cannot be. */
async function reduceOne(inputs: SolveInputs, night: NightRecord, rows: readonly TransitLogRow[], ctx: StoredNightContext): Promise<NightQuality> {
  const key = ctx.keys.get(night.id) ?? '';
  if (rows.length === 0) return failedQuality(night.id, key, 0, 'the night has no visible transit');
  const input = reductionInput(inputs, night, rows, ctx.timeScale);
  if (typeof input === 'string') return failedQuality(night.id, key, rows.length, input);
  try {
    const outcome = await reduceObservingNight(input, UNCONTROLLED);
    if (outcome.ok) return qualityOfReduction(night.id, key, outcome.result, ctx.apriori);
    return failedQuality(night.id, key, rows.length, [...outcome.problems, ...outcome.rejected.map((r) => `row ${r.row}: ${r.reason}`)].join('; '));
  } catch (error) {
    return failedQuality(night.id, key, rows.length, error instanceof Error ? error.message : String(error));
  }
}

/**
 * Reduces the nights of `content` (a few nights with their transits, and the archive's site,
 * instruments and stars) through the same records → folder files → import formats path as the
 * joint solve (renderer/worker/tasks/jointSolve.ts), so the nightly results match the CLI's on an
 * exported folder. When the folder cannot be read, each night is tried alone so that one bad row
 * marks only its own night.
 */
export async function reduceStoredNights(content: ArchiveContent, ctx: StoredNightContext): Promise<NightQuality[]> {
  const { inputs, problems } = readSolveInputs(encodeFolderFiles(writeArchiveFolder(keyedByCatalogueId(content))));
  if (inputs === null) {
    if (content.nights.length === 1) return [failedQuality(content.nights[0].id, ctx.keys.get(content.nights[0].id) ?? '', 0, `the stored night cannot be read as the reduction's input: ${problems.slice(0, 3).join('; ')}`)];
    const out: NightQuality[] = [];
    for (const night of content.nights) out.push(...await reduceStoredNights({ ...content, nights: [night], transits: content.transits.filter((t) => t.nightId === night.id) }, ctx));
    return out;
  }
  const rowsByKey = new Map<string, TransitLogRow[]>();
  for (const row of inputs.transits) {
    if (row.nightDateMjd === null) continue;
    const k = nightKey(row.nightDateMjd, row.instrumentId ?? night0Instrument(content));
    const list = rowsByKey.get(k);
    if (list === undefined) rowsByKey.set(k, [row]);
    else list.push(row);
  }
  const out: NightQuality[] = [];
  for (const [k, night] of inputs.nights) {
    const stored = content.nights.find((n) => n.id === night.id) ?? night;
    out.push(await reduceOne(inputs, stored, rowsByKey.get(k) ?? [], ctx));
  }
  return out;
}

function night0Instrument(content: ArchiveContent): string {
  return content.instruments[0]?.id ?? '';
}
