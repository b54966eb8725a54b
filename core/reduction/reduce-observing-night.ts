import type { Rejection } from '../formats/parse-result.ts';
import { utcCountS } from '../formats/utc-instant.ts';
import type { ClockFit } from '../instrument/clock-fit.ts';
import { TaskCancelledError } from '../task/task-control.ts';
import type { TaskControl } from '../task/task-control.ts';
import { DEG } from '../units.ts';
import { fitNightClock, nominalClockSeconds } from './night-clock.ts';
import type { NightClockModel } from './night-clock.ts';
import { NIGHT_CONSTANT_NAMES } from './night-inputs.ts';
import type { NightConstantName, NightReductionInput } from './night-inputs.ts';
import type { NightReductionResult } from './night-result.ts';
import { prepareTransits } from './prepare-transits.ts';
import type { PrepareContext, PreparedTransit } from './prepare-transits.ts';
import { resolveConstant } from './resolve-constants.ts';
import type { HeldConstant } from './resolve-constants.ts';
import { NightPredictions } from './star-predictions.ts';
import { fitNight } from './fit-night.ts';

/** The outcome: a reduction, or every reason the night could not be reduced (nothing half-done). */
export type NightOutcome =
  | { readonly ok: true; readonly result: NightReductionResult }
  | { readonly ok: false; readonly rejected: readonly Rejection[]; readonly problems: readonly string[] };

const CHUNK = 8;

function checkCancelled(control: TaskControl, done: number): void {
  if (control.cancellation.isCancelled) throw new TaskCancelledError('the nightly reduction', done);
}

/** Held values of every constant, or the list of settings that cannot be honoured. */
function resolveAll(input: NightReductionInput, clockFit: ClockFit | null): { held: Record<NightConstantName, HeldConstant>; problems: string[] } {
  const held = {} as Record<NightConstantName, HeldConstant>;
  const problems: string[] = [];
  for (const name of NIGHT_CONSTANT_NAMES) {
    const r = resolveConstant(name, input.configuration[name], input, clockFit);
    if (typeof r === 'string') problems.push(r);
    else held[name] = r;
  }
  return { held, problems };
}

/** The a priori clock model: held values, or the comparisons' fit (0 without) for free terms. */
function aprioriClock(input: NightReductionInput, held: Record<NightConstantName, HeldConstant>, clockFit: ClockFit | null): NightClockModel {
  const scale = input.instrument.clockTimeScale;
  const firstTimes = input.transits.map((r) => (r.times.kind === 'utc' ? utcCountS(r.times.wires[0].utc) - input.nightDateMjd * 86_400 : nominalClockSeconds(r.times.wires[0].clockS, scale)));
  const referenceS = clockFit?.referenceClockS ?? (firstTimes.length > 0 ? firstTimes.reduce((s, v) => s + v, 0) / firstTimes.length : 0);
  return {
    referenceS,
    offsetS: held.clockOffsetS?.value ?? clockFit?.offsetS ?? 0,
    rateSPerDay: held.clockRateSPerDay?.value ?? (clockFit?.rateDetermined ? clockFit.rateSPerS * 86_400 : 0),
  };
}

/**
 * The nightly reduction of one instrument on one night (steps in core/reduction/NIGHT.md): clock
 * correction from the comparisons (fitClock) or from the stars, mean wire, predicted passage
 * (core/astrometry, diurnal aberration included there ONCE — the instrument model adds none),
 * Mayer's reduction, least squares of the free constants with the robust outlier rule, O − C in
 * right ascension and zenith distance with refraction per observation, blunder hints. Reports
 * progress in transits; throws TaskCancelledError when cancelled (nothing is kept).
 */
export async function reduceObservingNight(input: NightReductionInput, control: TaskControl): Promise<NightOutcome> {
  const isClockLog = input.transits.some((r) => r.times.kind === 'clock');
  const notes: string[] = [];
  if (!isClockLog && input.clockComparisons.length > 0) notes.push('the log gives UTC times: the clock comparisons are not used');
  let clockFit: ClockFit | null = null;
  try {
    clockFit = isClockLog && input.clockComparisons.length > 0 ? fitNightClock(input.clockComparisons, input.nightDateMjd, input.instrument.clockTimeScale) : null;
  } catch (error) {
    return { ok: false, rejected: [], problems: [(error as Error).message] };
  }
  if (clockFit !== null) notes.push(...clockFit.notes.map((n) => `clock: ${n}`));
  const { held, problems } = resolveAll(input, clockFit);
  if (problems.length > 0) return { ok: false, rejected: [], problems };
  const site = { latitudeRad: input.site.latitudeDeg * DEG, longitudeRad: input.site.longitudeDeg * DEG, heightM: input.site.heightM };
  const predictions = new NightPredictions(site, input.nightDateMjd, input.instantFromUtc);
  const ctx: PrepareContext = {
    site, longitudeDeg: input.site.longitudeDeg, instrument: input.instrument, nightDateMjd: input.nightDateMjd, weather: input.weather, predictions,
    stars: new Map(input.stars.map((s) => [s.id, s])), aprioriClock: aprioriClock(input, held, clockFit),
  };
  const prepared: PreparedTransit[] = [];
  const rejected: Rejection[] = [];
  const total = input.transits.length;
  for (let i = 0; i < total; i += CHUNK) {
    checkCancelled(control, i);
    const part = prepareTransits(input.transits.slice(i, i + CHUNK), ctx);
    prepared.push(...part.transits);
    rejected.push(...part.rejected);
    for (const n of part.notes) if (!notes.includes(n)) notes.push(n);
    control.reportProgress(Math.min(total, i + CHUNK), total);
    await control.yieldToHost();
  }
  if (rejected.length > 0) return { ok: false, rejected, problems: [] };
  if (held.levelArcsec?.source === 'fixed' && held.levelArcsec.value === 0 && input.levelReadings === null) notes.push('level b held at 0: no striding-level readings for this night');
  try {
    const result = await fitNight(input, prepared, held, ctx, clockFit, notes, control);
    return { ok: true, result };
  } catch (error) {
    if (error instanceof TaskCancelledError) throw error;
    return { ok: false, rejected: [], problems: [(error as Error).message] };
  }
}
