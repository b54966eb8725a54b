import { describe, expect, it } from 'vitest';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { formatIsoUtc, parseIsoUtc } from '../../core/time/iso.ts';
import { calendarDayToMjd, daysBetween } from '../../core/time/julian-date.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { taiToUtc, utcToTai } from '../../core/time/utc-tai.ts';
import { loadErfaTimeFixture } from './erfa-fixture.ts';

const fixture = loadErfaTimeFixture();
const scale = new TimeScale(BUNDLED_LEAP_SECONDS);
const NS = 1e-9;
const US = 1e-6;
const secondsBetween = (a: { jd1: number; jd2: number }, b: number[]) => daysBetween(a, { jd1: b[0], jd2: b[1] }) * 86400;

describe(`TimeScale against ERFA ${fixture.header.erfaVersion} (utctai, taitt, dtdb; unit/fixtures/erfa_time.py)`, () => {
  it('fromUtc gives ERFA utctai/taitt to 1 ns over 1960–2100, leap seconds included', () => {
    for (const c of fixture.utc) {
      const instant = scale.fromUtc({ jd1: c.utc[0], jd2: c.utc[1] });
      expect(Math.abs(secondsBetween(instant.tai, c.tai))).toBeLessThan(1 * NS);
      expect(Math.abs(secondsBetween(instant.tt, c.tt))).toBeLessThan(1 * NS);
    }
  });

  it('TDB − TT within 0.25 µs of ERFA dtdb (full Fairhead & Bretagnon series, geocentre)', () => {
    let worst = 0;
    for (const c of fixture.utc) {
      const instant = scale.fromUtc({ jd1: c.utc[0], jd2: c.utc[1] });
      worst = Math.max(worst, Math.abs(daysBetween(instant.tdb, instant.tt) * 86400 - c.tdbMinusTtSeconds));
    }
    expect(worst).toBeLessThan(0.25 * US);
  });

  it('parseIsoUtc gives the quasi JD of ERFA dtf2d, on leap seconds too', () => {
    for (const c of fixture.utc) {
      const [y, mo, d, h, mi, s] = c.calendar;
      const text = `${y}-${String(mo).padStart(2, '0')}-${String(d).padStart(2, '0')}T${String(h).padStart(2, '0')}:${String(mi).padStart(2, '0')}:${s.toFixed(6).padStart(9, '0')}Z`;
      const parsed = parseIsoUtc(text, BUNDLED_LEAP_SECONDS);
      expect(Math.abs(secondsBetween(parsed.utcJd, c.utc))).toBeLessThan(1 * NS);
    }
  });
});

describe('UTC round trips (UTC → TAI → UTC, and through TT)', () => {
  it('UTC → TT → UTC returns the input to 1 µs across leap seconds, in ISO text', () => {
    const texts = ['2016-12-31T23:59:59.999999Z', '2016-12-31T23:59:60.000000Z', '2016-12-31T23:59:60.500000Z',
      '2016-12-31T23:59:60.999999Z', '2017-01-01T00:00:00.000000Z', '1972-06-30T23:59:60.250000Z',
      '1965-03-01T00:00:00.000001Z', '2088-02-29T12:34:56.789012Z',
      '1961-07-31T23:59:59.949999Z']; // that day was 0.05 s short (USNO tai-utc.dat, 1961 AUG 1)
    for (const text of texts) {
      const there = scale.fromIsoUtc(text);
      const back = scale.fromTt(there.tt);
      expect(formatIsoUtc(back.utc, BUNDLED_LEAP_SECONDS)).toBe(text);
      expect(Math.abs(daysBetween(back.utc, there.utc) * 86400)).toBeLessThan(1 * US);
    }
  });

  it('TAI advances by exactly 1 s through the leap second (2016-12-31T23:59:60Z)', () => {
    const before = scale.fromIsoUtc('2016-12-31T23:59:59.5Z');
    const during = scale.fromIsoUtc('2016-12-31T23:59:60.5Z');
    const after = scale.fromIsoUtc('2017-01-01T00:00:00.5Z');
    expect(daysBetween(during.tai, before.tai) * 86400).toBeCloseTo(1, 9);
    expect(daysBetween(after.tai, during.tai) * 86400).toBeCloseTo(1, 9);
  });

  it('taiToUtc inverts utcToTai to 1 ns on a grid through 1960–2030', () => {
    for (let mjd = 36934.3; mjd < 62000; mjd += 37.77) {
      const utc = { jd1: 2400000.5, jd2: mjd };
      const back = taiToUtc(utcToTai(utc, BUNDLED_LEAP_SECONDS), BUNDLED_LEAP_SECONDS);
      expect(Math.abs(daysBetween(back, utc) * 86400)).toBeLessThan(1 * NS);
    }
  });
});

describe('leap seconds in ISO text', () => {
  it('accepts 23:59:60 on a real leap-second day (IERS Bulletin C 52: end of 2016-12-31)', () => {
    const parsed = parseIsoUtc('2016-12-31T23:59:60.25Z', BUNDLED_LEAP_SECONDS);
    expect(parsed.second).toBe(60.25);
    expect(parsed.utcJd.jd1).toBe(2400000.5 + calendarDayToMjd(2016, 12, 31));
    expect(parsed.utcJd.jd2).toBeCloseTo(86400.25 / 86401, 15); // SOFA quasi-JD convention (dtf2d)
  });

  it('accepts the leap second written with an offset (RFC 3339 §5.7 example: 1990-12-31T15:59:60-08:00)', () => {
    const parsed = parseIsoUtc('1990-12-31T15:59:60-08:00', BUNDLED_LEAP_SECONDS);
    expect([parsed.year, parsed.month, parsed.day, parsed.hour, parsed.minute, parsed.second]).toEqual([1990, 12, 31, 23, 59, 60]);
  });

  it('rejects 23:59:60 on a day without a leap second, naming the table', () => {
    expect(() => parseIsoUtc('2015-12-31T23:59:60Z', BUNDLED_LEAP_SECONDS)).toThrow(/does not exist .*no leap second at the end of 2015-12-31/);
    expect(() => parseIsoUtc('2016-12-31T23:59:61Z', BUNDLED_LEAP_SECONDS)).toThrow(/does not exist/);
    expect(() => parseIsoUtc('2016-12-31T12:00:60Z', BUNDLED_LEAP_SECONDS)).toThrow(/below 60 outside the last minute/);
    // USNO tai-utc.dat: TAI − UTC fell by 0.05 s on 1961 Aug 1, so 1961-07-31 ended at 23:59:59.95.
    expect(() => parseIsoUtc('1961-07-31T23:59:59.95Z', BUNDLED_LEAP_SECONDS)).toThrow(/negative leap second/);
  });

  it('refuses a time without a zone and an impossible date', () => {
    expect(() => parseIsoUtc('2016-12-31T12:00:00', BUNDLED_LEAP_SECONDS)).toThrow(/add Z for UTC/);
    expect(() => parseIsoUtc('2023-02-29T12:00:00Z', BUNDLED_LEAP_SECONDS)).toThrow(/day must be an integer 1–28/);
  });

  it('formatIsoUtc prints the leap second and carries rounding into the next day', () => {
    const leap = parseIsoUtc('2016-12-31T23:59:60.123456Z', BUNDLED_LEAP_SECONDS).utcJd;
    expect(formatIsoUtc(leap, BUNDLED_LEAP_SECONDS)).toBe('2016-12-31T23:59:60.123456Z');
    const almost = parseIsoUtc('2016-12-31T23:59:60.9999999Z', BUNDLED_LEAP_SECONDS).utcJd;
    expect(formatIsoUtc(almost, BUNDLED_LEAP_SECONDS)).toBe('2017-01-01T00:00:00.000000Z');
  });
});

describe('fallbacks are reported in Instant.warnings', () => {
  it('without an EOP table: DUT1 = 0 and a warning that says how to load one', () => {
    const instant = scale.fromIsoUtc('2020-06-01T00:00:00Z');
    expect(instant.dut1Seconds).toBe(0);
    expect(instant.warnings.join(' ')).toMatch(/no Earth orientation table .* load an IERS finals2000A or C04 file/);
  });

  it('after the leap-second list expires: a warning names the expiry date', () => {
    expect(scale.fromIsoUtc('2030-01-01T00:00:00Z').warnings.join(' ')).toMatch(/expired on 2027-06-28/);
    expect(scale.fromIsoUtc('2025-01-01T00:00:00Z').warnings.join(' ')).not.toMatch(/expired/);
  });

  it('before 1960: UT1 = given time and TT = UT1 + ΔT (Espenak & Meeus), with a warning', () => {
    const instant = scale.fromIsoUtc('1950-01-01T00:00:00Z');
    // Espenak & Meeus (2006) 1941–1961 polynomial at y ≈ 1950.0: 29.07 s.
    expect(daysBetween(instant.tt, instant.ut1) * 86400).toBeCloseTo(29.07, 1);
    expect(instant.warnings.join(' ')).toMatch(/UTC did not exist before 1960/);
    const back = scale.fromTt(instant.tt);
    expect(Math.abs(daysBetween(back.ut1, instant.ut1) * 86400)).toBeLessThan(1 * US);
  });
});
