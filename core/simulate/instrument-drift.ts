import type { InstrumentEventKind } from '../archive/records.ts';
import type { SeededRandom } from './seeded-random.ts';

/**
 * The true state of one instrument as it drifts from night to night (numbers of our own, typical
 * of a well-kept small transit instrument): azimuth a, level b and collimation c do random walks
 * (σ 0.04″, 0.05″ and 0.02″ per √day) around their settings, with steps at instrument events;
 * the micrometer zero point walks by 0.03″ per √day and steps at adjustments; the quartz clock's
 * rate walks by 0.004 s/day per √day, pulled back toward +0.02 s/day, and the observer resets the
 * clock to within 0.2 s of UTC whenever it has wandered past 1.5 s (a `clock-change` event).
 */
export interface DriftState {
  azimuthArcsec: number;
  levelArcsec: number;
  collimationArcsec: number;
  zeroPointArcsec: number;
  clockOffsetS: number;
  clockRateSPerDay: number;
  /** UTC MJD at which the values above hold. */
  atMjd: number;
}

export interface PlantedEvent {
  readonly utcMjd: number;
  readonly kind: InstrumentEventKind;
  readonly note: string;
}

const NOMINAL_RATE_S_PER_DAY = 0.02;
const RATE_PULL_PER_DAY = 0.02;

export function initialDrift(random: SeededRandom, startMjd: number): DriftState {
  return {
    azimuthArcsec: random.normal(0, 2.5),
    levelArcsec: random.normal(0, 1.5),
    collimationArcsec: random.normal(0, 1.2),
    zeroPointArcsec: random.normal(0, 3),
    clockOffsetS: random.normal(0, 0.3),
    clockRateSPerDay: NOMINAL_RATE_S_PER_DAY + random.normal(0, 0.01),
    atMjd: startMjd,
  };
}

/** Moves the state forward to `mjd` (≥ its time), applying the random walks. Returns clock resets. */
export function advanceDrift(state: DriftState, mjd: number, random: SeededRandom): PlantedEvent[] {
  const days = mjd - state.atMjd;
  if (days < 0) throw new RangeError(`advanceDrift: time runs backwards (${mjd} < ${state.atMjd}); advance nights in order`);
  const root = Math.sqrt(days);
  state.azimuthArcsec += random.normal(0, 0.04 * root);
  state.levelArcsec += random.normal(0, 0.05 * root);
  state.collimationArcsec += random.normal(0, 0.02 * root);
  state.zeroPointArcsec += random.normal(0, 0.03 * root);
  const meanRate = state.clockRateSPerDay;
  state.clockOffsetS += meanRate * days;
  state.clockRateSPerDay += -RATE_PULL_PER_DAY * days * (state.clockRateSPerDay - NOMINAL_RATE_S_PER_DAY) + random.normal(0, 0.004 * root);
  state.atMjd = mjd;
  if (Math.abs(state.clockOffsetS) <= 1.5) return [];
  const before = state.clockOffsetS;
  state.clockOffsetS = random.normal(0, 0.1);
  return [{ utcMjd: mjd, kind: 'clock-change', note: `clock reset from ${before.toFixed(3)} s to ${state.clockOffsetS.toFixed(3)} s (simulated)` }];
}

/** Applies an event's steps to the state (kinds and sizes of our own). */
export function applyEvent(state: DriftState, kind: InstrumentEventKind, random: SeededRandom): string {
  const before = { a: state.azimuthArcsec, b: state.levelArcsec, c: state.collimationArcsec, z: state.zeroPointArcsec };
  if (kind === 'adjustment') {
    state.azimuthArcsec = random.normal(0, 2);
    state.collimationArcsec = random.normal(0, 1);
    state.zeroPointArcsec += random.normal(0, 2);
  } else if (kind === 'relevelling') {
    state.levelArcsec = random.normal(0, 1);
  } else if (kind === 'recollimation') {
    state.collimationArcsec = random.normal(0, 0.5);
  } else if (kind === 'cleaning') {
    state.zeroPointArcsec += random.normal(0, 0.3);
  }
  const step = (name: string, from: number, to: number): string => (from === to ? '' : ` ${name} ${from.toFixed(2)}″→${to.toFixed(2)}″`);
  return `${kind} (simulated):${step('a', before.a, state.azimuthArcsec)}${step('b', before.b, state.levelArcsec)}${step('c', before.c, state.collimationArcsec)}${step('zero', before.z, state.zeroPointArcsec)}`.trimEnd();
}

/** Event dates and kinds: a Poisson process of `perYear` events over the span, at local midday. */
export function planEvents(startMjd: number, days: number, perYear: number, random: SeededRandom): { utcMjd: number; kind: InstrumentEventKind }[] {
  const events: { utcMjd: number; kind: InstrumentEventKind }[] = [];
  if (perYear <= 0) return events;
  let t = startMjd;
  for (;;) {
    t += (-Math.log(1 - random.uniform()) * 365.25) / perYear;
    if (t >= startMjd + days) return events;
    const draw = random.uniform();
    const kind: InstrumentEventKind = draw < 0.4 ? 'adjustment' : draw < 0.7 ? 'relevelling' : draw < 0.85 ? 'recollimation' : 'cleaning';
    events.push({ utcMjd: Math.floor(t) + 0.45, kind });
  }
}
