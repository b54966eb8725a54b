import { SECONDS_PER_DAY } from '../../core/units.ts';

/** A value accepted by a field, or the reason it was refused (shown at the field, never coerced). */
export type FieldResult<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly reason: string };

const refuse = (reason: string): FieldResult<never> => ({ ok: false, reason });

/** How far a typed time may lie from the predicted transit before it is refused (a wrong star or clock). */
export const MAX_DISTANCE_FROM_PREDICTION_S = 15 * 60;

/**
 * A clock time of day `HH:MM:SS[.s…]` (24 h; also `HH MM SS.s`), seconds since 0 h. Refuses
 * hours ≥ 24, minutes or seconds ≥ 60, and any other text, with the reason.
 */
export function parseClockTime(text: string): FieldResult<number> {
  const match = /^\s*(\d{1,2})[: ](\d{1,2})[: ](\d{1,2}(?:\.\d+)?)\s*$/.exec(text);
  if (match === null) return refuse(`"${text}" is not a clock time; type HH:MM:SS.s, e.g. 21:04:37.2`);
  const [hours, minutes, seconds] = [Number(match[1]), Number(match[2]), Number(match[3])];
  if (hours > 23) return refuse(`hour ${hours} is impossible; the clock runs 0–23 h`);
  if (minutes > 59) return refuse(`minute ${minutes} is impossible; minutes run 0–59`);
  if (seconds >= 60) return refuse(`second ${match[3]} is impossible; seconds run below 60`);
  return { ok: true, value: hours * 3600 + minutes * 60 + seconds };
}

/**
 * The clock MJD of a time of day `secondsOfDay` nearest to `nearClockMjd` (the predicted transit
 * on the same clock), so a transit near midnight lands on the right date.
 */
export function clockMjdNear(secondsOfDay: number, nearClockMjd: number): number {
  const day = Math.floor(nearClockMjd);
  const candidates = [day - 1, day, day + 1].map((d) => d + secondsOfDay / SECONDS_PER_DAY);
  return candidates.reduce((best, c) => (Math.abs(c - nearClockMjd) < Math.abs(best - nearClockMjd) ? c : best));
}

/** Typed wire times: one entry per wire of the instrument (null for a wire not seen), or one time. */
export interface WireEntry {
  /** Clock MJD per wire, or null where the observer typed `-` (missed wire). */
  readonly wireClockMjd: readonly (number | null)[];
  /** True when a single time was typed (the mean wire, or a single reference line). */
  readonly single: boolean;
}

/**
 * Parses wire times separated by spaces or commas: either one time, or exactly `wireCount` items
 * where `-` marks a missed wire. Each time must lie within MAX_DISTANCE_FROM_PREDICTION_S of the
 * predicted clock time `predictedClockMjd`.
 */
export function parseWireTimes(text: string, wireCount: number, predictedClockMjd: number): FieldResult<WireEntry> {
  const items = text.split(/[\s,;]+/).filter((item) => item !== '');
  if (items.length === 0) return refuse('no time typed; type the wire times (or one time) as HH:MM:SS.s');
  if (items.length !== 1 && items.length !== wireCount) {
    return refuse(`${items.length} times typed, but the instrument has ${wireCount} wires; type ${wireCount} times (- for a missed wire) or one time`);
  }
  const wireClockMjd: (number | null)[] = [];
  for (const [index, item] of items.entries()) {
    if (item === '-') {
      wireClockMjd.push(null);
      continue;
    }
    const time = parseClockTime(item);
    if (!time.ok) return refuse(`wire ${index + 1}: ${time.reason}`);
    const mjd = clockMjdNear(time.value, predictedClockMjd);
    const offsetS = (mjd - predictedClockMjd) * SECONDS_PER_DAY;
    if (Math.abs(offsetS) > MAX_DISTANCE_FROM_PREDICTION_S) {
      return refuse(`wire ${index + 1}: ${item} is ${(offsetS / 60).toFixed(1)} min from the predicted transit; check the star, the clock offset or the hour`);
    }
    wireClockMjd.push(mjd);
  }
  if (wireClockMjd.every((t) => t === null)) return refuse('every wire is marked missed (-); type at least one time');
  return { ok: true, value: { wireClockMjd, single: items.length === 1 && wireCount !== 1 } };
}

/**
 * A zenith-distance reading in the instrument's unit; the zenith distance it gives
 * (`zenithOfReadingDeg`) must lie in 0–90°, else the reading or the zero point is wrong.
 */
export function parseReading(text: string, zenithOfReadingDeg: (reading: number) => number): FieldResult<number | null> {
  const trimmed = text.trim();
  if (trimmed === '') return { ok: true, value: null };
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(trimmed)) return refuse(`"${text}" is not a number; type the reading as a decimal, e.g. 12.345`);
  const reading = Number(trimmed);
  const zenithDeg = zenithOfReadingDeg(reading);
  if (!(zenithDeg >= 0 && zenithDeg <= 90)) {
    return refuse(`reading ${reading} gives zenith distance ${zenithDeg.toFixed(2)}°, outside 0–90°; check the reading or tonight's zero point`);
  }
  return { ok: true, value: reading };
}

/** A star picked by its catalogue id; an id not in the programme is refused with the reason. */
export function findProgrammeStar<T extends { readonly catalogueId: string }>(catalogueId: string, stars: readonly T[]): FieldResult<T> {
  const wanted = catalogueId.trim();
  const star = stars.find((candidate) => candidate.catalogueId === wanted);
  if (star === undefined) return refuse(`star "${wanted}" is not in tonight's programme; pick one of the listed ids`);
  return { ok: true, value: star };
}

/** The three fields of the live log entry, as typed. */
export interface LogDraftFields {
  readonly starCatalogueId: string;
  readonly wiresText: string;
  readonly readingText: string;
}
