import { describe, expect, it } from 'vitest';
import type { InstrumentRecord, StarRecord } from '../../core/archive/records.ts';
import { reduceToMeanWire } from '../../core/instrument/wire-reduction.ts';
import { ARCSEC, DEG, SECONDS_PER_DAY } from '../../core/units.ts';
import { findProgrammeStar, parseClockTime, parseReading, parseWireTimes, type WireEntry } from '../../renderer/tonight/entryParsing.ts';
import { checkEntry, expectedWireClockMjd } from '../../renderer/tonight/observedMinusComputed.ts';
import type { ProgrammeRow } from '../../renderer/tonight/programmeRows.ts';

// An invented instrument; the expected values come from core/instrument (reduceToMeanWire,
// blunderHints) and the relation z = zero + sense·scale·reading, not from this file's code.
const INSTRUMENT = {
  id: 'i1', label: 'Test transit', kind: 'transit', siteId: 's1', readingUnit: 'micrometer-turn', readingScaleArcsecPerUnit: 30,
  readingSense: 1, wireIntervalsEquatorialS: [30, 15, 0, -15, -30], effectiveWavelengthNm: 550, clockLabel: 'pier clock', note: '',
  visibility: 'visible', createdUtc: '', updatedUtc: '',
} satisfies InstrumentRecord;
const DECLINATION_RAD = 50 * DEG;
const PREDICTED_CLOCK_MJD = 60_735.9 + 0.25 / SECONDS_PER_DAY;
const ROW = {
  key: 'k', star: { catalogueId: 'ML-01' } as StarRecord, clockMjd: PREDICTED_CLOCK_MJD, zenithDistanceDeg: 3, readingSetting: 0, daylight: false,
  transit: {
    starId: 's', culmination: 'upper', utcMjd: PREDICTED_CLOCK_MJD, side: 'north', geometricZenithRad: 3 * DEG, observedZenithRad: 3 * DEG,
    declinationRad: DECLINATION_RAD, sunAltitudeRad: -0.5, starSunSeparationRad: 2, caution: null, warnings: [],
  },
} satisfies ProgrammeRow;
const SETTING = { zeroPointDeg: 2.9, clamp: 'west' as const, tolerances: { timeS: 0.3, zenithArcsec: 2 } };
const MICROSECOND = 1e-6;

describe('checkEntry(row, predicted, wires, reading, …)', () => {
  const expected = expectedWireClockMjd(ROW, PREDICTED_CLOCK_MJD, INSTRUMENT, 'west');
  const wires = (times: (number | null)[]): WireEntry => ({ wireClockMjd: times, single: false });

  it('gives O−C 0 for the expected wire times: they reduce back to the prediction through core reduceToMeanWire', () => {
    const check = checkEntry(ROW, PREDICTED_CLOCK_MJD, wires(expected), null, INSTRUMENT, SETTING, []);
    expect(Math.abs(check.timeOmcS)).toBeLessThan(MICROSECOND);
    expect(check.timeFlagged).toBe(false);
    expect(check.hints).toEqual([]);
    expect(check.zenithOmcArcsec).toBeNull();
    // The first wire of an upper culmination with clamp west comes 30 s·sec δ (sidereal, on a mean-solar clock) early.
    expect((PREDICTED_CLOCK_MJD - expected[0]) * SECONDS_PER_DAY).toBeGreaterThan(30 / Math.cos(DECLINATION_RAD) * 0.997);
  });

  it('a time delayed by 0.2 s on every wire gives O−C +0.2 s, within a 0.3 s tolerance', () => {
    const check = checkEntry(ROW, PREDICTED_CLOCK_MJD, wires(expected.map((t) => t + 0.2 / SECONDS_PER_DAY)), null, INSTRUMENT, SETTING, []);
    expect(check.timeOmcS).toBeCloseTo(0.2, 5);
    expect(check.timeFlagged).toBe(false);
  });

  it('one wire entered against its neighbour is flagged, with "wire miscounted" as the probable cause', () => {
    const planted = [...expected];
    planted[1] = expected[2];
    const check = checkEntry(ROW, PREDICTED_CLOCK_MJD, wires(planted), null, INSTRUMENT, SETTING, []);
    // core reduceToMeanWire on the same wires, with the mean relative to the prediction:
    const core = reduceToMeanWire(planted.map((t, wireIndex) => ({ wireIndex, clockTimeS: (t - PREDICTED_CLOCK_MJD) * SECONDS_PER_DAY })), INSTRUMENT.wireIntervalsEquatorialS, DECLINATION_RAD, 'upper', 'west', 'mean-solar');
    expect(check.timeOmcS).toBeCloseTo(core.meanWireTimeS, 9);
    expect(Math.abs(check.timeOmcS)).toBeCloseTo((15 / Math.cos(DECLINATION_RAD) / 5) * 0.99727, 2); // spacing·sec δ / n wires, mean-solar clock
    expect(check.timeFlagged).toBe(true);
    expect(check.hints[0]).toMatch(/neighbouring wire/);
  });

  it('a missed wire (null) leaves the mean unbiased', () => {
    const check = checkEntry(ROW, PREDICTED_CLOCK_MJD, wires([expected[0], null, ...expected.slice(2)]), null, INSTRUMENT, SETTING, []);
    expect(Math.abs(check.timeOmcS)).toBeLessThan(MICROSECOND);
  });

  it('zenith O−C from the reading: (zero + sense·scale·reading) − predicted z, and one turn off is named', () => {
    const reading = (3 - 2.9) * 3600 / 30 + 0.5 / 30; // 0.5″ beyond the prediction
    const good = checkEntry(ROW, PREDICTED_CLOCK_MJD, wires(expected), reading, INSTRUMENT, SETTING, []);
    expect(good.zenithOmcArcsec).toBeCloseTo(0.5, 6);
    expect(good.zenithFlagged).toBe(false);
    const turnOff = checkEntry(ROW, PREDICTED_CLOCK_MJD, wires(expected), reading + 1, INSTRUMENT, SETTING, []);
    expect(turnOff.zenithOmcArcsec).toBeCloseTo(30.5, 6);
    expect(turnOff.zenithFlagged).toBe(true);
    expect(turnOff.hints).toContain('micrometer turns miscounted by 1');
  });

  it('a whole second off the clock is named', () => {
    const check = checkEntry(ROW, PREDICTED_CLOCK_MJD, { wireClockMjd: [PREDICTED_CLOCK_MJD + 1 / SECONDS_PER_DAY], single: true }, null, INSTRUMENT, SETTING, []);
    expect(check.timeOmcS).toBeCloseTo(1, 6);
    expect(check.hints[0]).toMatch(/off by \+1 s/);
  });

  it('an observation that fits another programme star is named as the wrong star', () => {
    const other = { catalogueId: 'ML-07', predictedClockMjd: PREDICTED_CLOCK_MJD + 200 / SECONDS_PER_DAY };
    const check = checkEntry(ROW, PREDICTED_CLOCK_MJD, { wireClockMjd: [other.predictedClockMjd], single: true }, null, INSTRUMENT, SETTING, [other]);
    expect(check.hints.some((hint) => hint.includes('ML-07'))).toBe(true);
  });
});

describe('refusals at the field', () => {
  it('parseClockTime refuses impossible hours, minutes and seconds with the range', () => {
    expect(parseClockTime('21:04:37.25')).toEqual({ ok: true, value: 21 * 3600 + 4 * 60 + 37.25 });
    expect(parseClockTime('24:00:00')).toEqual({ ok: false, reason: 'hour 24 is impossible; the clock runs 0–23 h' });
    expect(parseClockTime('21:60:00')).toMatchObject({ ok: false, reason: expect.stringMatching(/minute 60 is impossible/) });
    expect(parseClockTime('21:04:60.0')).toMatchObject({ ok: false, reason: expect.stringMatching(/second 60.0 is impossible/) });
    expect(parseClockTime('nine')).toMatchObject({ ok: false, reason: expect.stringMatching(/type HH:MM:SS.s/) });
  });

  it('parseWireTimes refuses a wrong number of times, a time far from the prediction, and all wires missed', () => {
    const near = 60_000 + 21 / 24;
    expect(parseWireTimes('21:00:01 21:00:02', 5, near)).toMatchObject({ ok: false, reason: expect.stringMatching(/2 times typed, but the instrument has 5 wires/) });
    expect(parseWireTimes('21:20:00', 5, near)).toMatchObject({ ok: false, reason: expect.stringMatching(/20.0 min from the predicted transit/) });
    expect(parseWireTimes('- - - - -', 5, near)).toMatchObject({ ok: false, reason: expect.stringMatching(/every wire is marked missed/) });
    const ok = parseWireTimes('21:00:01 - 21:00:03 21:00:04 21:00:05', 5, near);
    expect(ok.ok && ok.value.wireClockMjd[1]).toBeNull();
    const midnight = parseWireTimes('00:00:10', 5, 60_001 - 5 / SECONDS_PER_DAY);
    expect(midnight.ok && midnight.value.wireClockMjd[0]).toBeCloseTo(60_001 + 10 / SECONDS_PER_DAY, 9);
  });

  it('parseReading refuses text and readings that give a zenith distance outside 0–90°', () => {
    const zenithDeg = (reading: number) => 2.9 + (reading * 30 * ARCSEC) / DEG;
    expect(parseReading('12.5', zenithDeg)).toEqual({ ok: true, value: 12.5 });
    expect(parseReading('', zenithDeg)).toEqual({ ok: true, value: null });
    expect(parseReading('12,5', zenithDeg)).toMatchObject({ ok: false, reason: expect.stringMatching(/not a number/) });
    expect(parseReading('-400', zenithDeg)).toMatchObject({ ok: false, reason: expect.stringMatching(/outside 0–90°/) });
  });

  it('findProgrammeStar refuses an unknown star id', () => {
    expect(findProgrammeStar('ML-99', [{ catalogueId: 'ML-01' }])).toEqual({ ok: false, reason: 'star "ML-99" is not in tonight\'s programme; pick one of the listed ids' });
  });
});
