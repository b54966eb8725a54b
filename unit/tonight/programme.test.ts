import { describe, expect, it } from 'vitest';
import type { InstrumentRecord, StarRecord } from '../../core/archive/records.ts';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import { zenithDistanceFromReading } from '../../core/instrument/zenith-distance.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { calendarDayToMjd } from '../../core/time/julian-date.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { ARCSEC, DEG, SECONDS_PER_DAY } from '../../core/units.ts';
import { countdownText, nextObservableIndex, programmeRows } from '../../renderer/tonight/programmeRows.ts';
import { mjdToIsoDate, nightWindowAt, nightWindowOfDate } from '../../renderer/tonight/nightWindow.ts';
import { runTonightProgramme, type ProgrammeStarInput } from '../../renderer/worker/tasks/tonightProgramme.ts';

const MICROSECOND_DAYS = 1e-6 / SECONDS_PER_DAY;

// Invented site and instrument (the demo scenario's kind); star places are check inputs only:
// Vega and Polaris from the Hipparcos new reduction (van Leeuwen 2007), rounded, from memory.
const SITE = { latitudeDeg: 47, longitudeDeg: 8, heightM: 500 };
const STARS: StarRecord[] = [
  star('vega', 'HIP 91262', 279.2347, 38.7837, 200.94, 286.23, 130.23),
  star('polaris', 'HIP 11767', 37.9461, 89.2641, 44.48, -11.85, 7.54),
  star('south', 'TEST-S', 120.0, -20.0, 0, 0, 0),
];
const INSTRUMENT = {
  id: 'i1', label: 'Test transit', kind: 'transit', siteId: 's1', readingUnit: 'micrometer-turn', readingScaleArcsecPerUnit: 30.5,
  readingSense: -1, wireIntervalsEquatorialS: [30, 15, 0, -15, -30], effectiveWavelengthNm: 550, clockLabel: 'pier clock', note: '',
  visibility: 'visible', createdUtc: '', updatedUtc: '',
} satisfies InstrumentRecord;

function star(id: string, catalogueId: string, raDeg: number, decDeg: number, pmRaMasYr: number, pmDecMasYr: number, parallaxMas: number): StarRecord {
  return {
    id, catalogueId, label: catalogueId, raDeg, decDeg, catalogueEpochJulianYear: 1991.25, pmRaMasYr, pmDecMasYr, parallaxMas,
    parallaxErrorMas: 0.2, radialVelocityKmS: 0, magnitude: null, source: 'test', programmes: ['p'], visibility: 'visible', createdUtc: '', updatedUtc: '',
  };
}

const input = (s: StarRecord): ProgrammeStarInput => s;

describe('nightWindowAt / mjdToIsoDate', () => {
  it('mjdToIsoDate(51544) is 2000-01-01 (MJD 51544.0 = 2000 January 1, 0h: Explanatory Supplement, from memory)', () => {
    expect(mjdToIsoDate(51544)).toBe('2000-01-01');
  });
  it('mjdToIsoDate inverts core calendarDayToMjd over 1990–2040', () => {
    for (let mjd = calendarDayToMjd(1990, 1, 1); mjd < calendarDayToMjd(2040, 1, 1); mjd += 37) {
      const [y, m, d] = mjdToIsoDate(mjd).split('-').map(Number);
      expect(calendarDayToMjd(y, m, d)).toBe(mjd);
    }
  });
  it('dates a night by its evening: 02:00 local mean time belongs to the previous date', () => {
    const mjd = calendarDayToMjd(2025, 3, 2) + (2 - 8 / 15) / 24; // 02:00 LMT at 8° E
    const window = nightWindowAt(mjd, 8);
    expect(window.localDate).toBe('2025-03-01');
    expect(window.fromUtcMjd).toBeCloseTo(calendarDayToMjd(2025, 3, 1) + 0.5 - 8 / 360, 12);
    expect(nightWindowOfDate('2025-03-01', 8)).toEqual(window);
  });
  it('refuses a badly written date with the format to use', () => {
    expect(() => nightWindowOfDate('1 March 2025', 8)).toThrow(/YYYY-MM-DD/);
  });
});

describe('runTonightProgramme and programmeRows', async () => {
  const window = nightWindowOfDate('2025-03-01', SITE.longitudeDeg);
  const result = await runTonightProgramme({ kind: 'tonight-programme', site: SITE, stars: STARS.map(input), ...window, weather: null }, UNCONTROLLED);

  it('gives each star its transits in the window, in time order, both culminations of a circumpolar star', () => {
    const times = result.transits.map((t) => t.utcMjd);
    expect(times).toEqual([...times].sort((a, b) => a - b));
    expect(result.failures).toEqual([]);
    expect(result.transits.filter((t) => t.starId === 'polaris').map((t) => t.culmination).sort()).toEqual(['lower', 'upper']);
    expect(result.transits.filter((t) => t.starId === 'vega').map((t) => t.culmination)).toEqual(['upper']); // not circumpolar at 47°: 38.8 < 90 − 47
    expect(result.transits.filter((t) => t.starId === 'south').map((t) => t.culmination)).toEqual(['upper']);
    for (const t of result.transits) expect(t.utcMjd).toBeGreaterThan(window.fromUtcMjd);
  });

  it('matches core predictTransit for each entry to 1 µs (the worker adds no model of its own)', () => {
    const scale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
    const site = { latitudeRad: SITE.latitudeDeg * DEG, longitudeRad: SITE.longitudeDeg * DEG, heightM: SITE.heightM };
    for (const t of result.transits) {
      const s = STARS.find((candidate) => candidate.id === t.starId)!;
      const motion = starMotion({ raRad: s.raDeg * DEG, decRad: s.decDeg * DEG, pmRaCosDecMasYr: s.pmRaMasYr, pmDecMasYr: s.pmDecMasYr, parallaxMas: s.parallaxMas, radialVelocityKmS: 0, epochJulianYear: s.catalogueEpochJulianYear });
      const p = predictTransit(motion, site, null, { jd1: 2_400_000.5, jd2: t.utcMjd - 0.01 }, t.culmination, (utc) => scale.fromUtc(utc), iauEarthOrientation);
      expect(Math.abs(p.utc.jd1 - 2_400_000.5 + p.utc.jd2 - t.utcMjd)).toBeLessThan(MICROSECOND_DAYS);
      expect(p.place.topocentricZenithRad).toBeCloseTo(t.geometricZenithRad, 12);
    }
  });

  it('greys daylight transits by the Sun altitude, shows the solar caution only for them, and skips them as "next"', () => {
    const rows = programmeRows(result.transits, STARS, INSTRUMENT, { zeroPointDeg: 40, clockMinusUtcS: 2.5 });
    expect(rows.some((row) => row.daylight)).toBe(true);
    for (const row of rows) {
      expect(row.daylight).toBe(row.transit.sunAltitudeRad > 0);
      if (row.transit.caution !== null) expect(row.daylight).toBe(true);
      expect((row.clockMjd! - row.transit.utcMjd) * SECONDS_PER_DAY).toBeCloseTo(2.5, 6);
    }
    const next = nextObservableIndex(rows, window.fromUtcMjd, new Set());
    expect(rows[next].daylight).toBe(false);
    expect(rows.slice(0, next).every((row) => row.daylight)).toBe(true);
    expect(nextObservableIndex(rows, window.fromUtcMjd, new Set([rows[next].key]))).toBeGreaterThan(next);
  });

  it('sets the micrometer so that core zenithDistanceFromReading gives back the predicted zenith distance (1e-9″)', () => {
    const rows = programmeRows(result.transits, STARS, INSTRUMENT, { zeroPointDeg: 40, clockMinusUtcS: null });
    for (const row of rows) {
      const z = zenithDistanceFromReading(row.readingSetting, { zeroPointRad: 40 * DEG, scaleRadPerUnit: 30.5 * ARCSEC, sense: -1 });
      expect(Math.abs(z - row.transit.observedZenithRad)).toBeLessThan(1e-9 * ARCSEC);
      expect(row.clockMjd).toBeNull();
    }
  });

  it('countdownText(utc, now) counts down in H:MM:SS and signs a passed transit', () => {
    expect(countdownText(1 + 3725 / SECONDS_PER_DAY, 1)).toBe('1:02:05');
    expect(countdownText(1, 1 + 65 / SECONDS_PER_DAY)).toBe('−0:01:05');
  });
});
