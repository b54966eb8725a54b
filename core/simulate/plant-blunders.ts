import type { InstrumentRecord } from '../archive/records.ts';
import { SECONDS_PER_DAY } from '../units.ts';
import type { SeededRandom } from './seeded-random.ts';
import type { BlunderKind, PlantedBlunder } from './simulation-truth.ts';

/** A transit as it will be written, open to a blunder. */
export interface MutableTransit {
  id: string;
  starId: string;
  clockMjd: number;
  wireClockMjd: number[];
  zenithReadings: number[];
}

const KINDS: readonly BlunderKind[] = ['wire-miscounted', 'turn-slipped', 'star-swapped', 'clock-second'];

/**
 * Plants one blunder of a random kind in `transit` and says what was done:
 * - `wire-miscounted`: one wire's time is written in a neighbouring wire's column (the observer
 *   counted wires wrongly), so that time is off by one wire spacing (~10 s sec δ);
 * - `turn-slipped`: the zenith reading is off by one whole micrometer turn (or 10 pixels);
 * - `star-swapped`: the transit is written under another programme star's id (`otherStarId`);
 * - `clock-second`: every time of the transit is off by one whole second (a misread clock).
 * A wire blunder on a transit with fewer than two wire times, or a swap when no other star is free
 * (`otherStarId` null), becomes a clock second.
 */
export function plantBlunder(transit: MutableTransit, instrument: InstrumentRecord, otherStarId: string | null, random: SeededRandom): PlantedBlunder {
  let kind = KINDS[random.integer(KINDS.length)];
  if (kind === 'star-swapped' && otherStarId === null) kind = 'clock-second';
  const observed = transit.wireClockMjd.map((t, k) => (Number.isFinite(t) ? k : -1)).filter((k) => k >= 0);
  if (kind === 'wire-miscounted' && observed.length < 2) kind = 'clock-second';
  if (kind === 'wire-miscounted') {
    const wires = transit.wireClockMjd;
    const from = observed[random.integer(observed.length)];
    const to = from + 1 < wires.length && !Number.isFinite(wires[from + 1]) ? from + 1 : from > 0 && !Number.isFinite(wires[from - 1]) ? from - 1 : -1;
    if (to >= 0) {
      wires[to] = wires[from];
      wires[from] = Number.NaN;
      return { transitId: transit.id, kind, detail: `wire ${from + 1}'s time written as wire ${to + 1}` };
    }
    // Both neighbours observed: the two times are exchanged.
    const other = from + 1 < wires.length ? from + 1 : from - 1;
    [wires[from], wires[other]] = [wires[other], wires[from]];
    return { transitId: transit.id, kind, detail: `times of wires ${from + 1} and ${other + 1} exchanged` };
  }
  if (kind === 'turn-slipped') {
    const turns = (random.chance(0.5) ? 1 : -1) * (instrument.readingUnit === 'pixel' ? 10 : 1);
    transit.zenithReadings = transit.zenithReadings.map((r) => r + turns);
    return { transitId: transit.id, kind, detail: `zenith reading off by ${turns > 0 ? '+' : ''}${turns} ${instrument.readingUnit}` };
  }
  if (kind === 'star-swapped' && otherStarId !== null) {
    const trueStarId = transit.starId;
    transit.starId = otherStarId;
    return { transitId: transit.id, kind, detail: `observed ${trueStarId}, written as ${otherStarId}`, trueStarId };
  }
  const seconds = random.chance(0.5) ? 1 : -1;
  transit.clockMjd += seconds / SECONDS_PER_DAY;
  transit.wireClockMjd = transit.wireClockMjd.map((t) => t + seconds / SECONDS_PER_DAY);
  return { transitId: transit.id, kind: 'clock-second', detail: `every clock time off by ${seconds > 0 ? '+' : ''}${seconds} s` };
}
