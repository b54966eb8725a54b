import type { NightRecord, SiteRecord, StarRecord, TransitRecord } from '../../core/archive/records.ts';

// Invented test rows (no real site or star); only their structure matters to the store tests.
const STAMP = '2026-01-01T00:00:00.000Z';

export function siteRow(id: string, overrides: Partial<SiteRecord> = {}): SiteRecord {
  return {
    id, label: `Site ${id}`, latitudeDeg: 47.25, longitudeDeg: 8.5, heightM: 612, note: '',
    visibility: 'visible', createdUtc: STAMP, updatedUtc: STAMP, ...overrides,
  };
}

export function starRow(id: string, overrides: Partial<StarRecord> = {}): StarRecord {
  return {
    id, catalogueId: `X ${id}`, label: `Star ${id}`, raDeg: 10, decDeg: 40,
    catalogueEpochJulianYear: 2016, pmRaMasYr: 1, pmDecMasYr: -2, parallaxMas: 5,
    parallaxErrorMas: 0.05, radialVelocityKmS: 0, magnitude: 6.1, source: 'invented',
    programmes: ['north'], visibility: 'visible', createdUtc: STAMP, updatedUtc: STAMP, ...overrides,
  };
}

export function nightRow(id: string, overrides: Partial<NightRecord> = {}): NightRecord {
  return {
    id, siteId: 'site-1', instrumentId: 'instr-1', localDate: '2026-01-01', observer: 'A. Observer',
    weather: null, clockComparisons: [], levelReadings: [], collimationReadings: [], quality: 'good',
    note: '', visibility: 'visible', createdUtc: STAMP, updatedUtc: STAMP, ...overrides,
  };
}

export function transitRow(id: string, overrides: Partial<TransitRecord> = {}): TransitRecord {
  return {
    id, nightId: 'night-1', starId: 'star-1', instrumentId: 'instr-1', culmination: 'upper',
    clockMjd: 61_000.9, wireClockMjd: [], utcMjd: 61_000.9, zenithReadings: [12.345], weather: null,
    weight: 1, userRejected: false, flaggedOutlier: false, note: '',
    visibility: 'visible', createdUtc: STAMP, updatedUtc: STAMP, ...overrides,
  };
}

let counter = 0;
/** A database name no other test uses (fake-indexeddb is shared by the whole test file). */
export function uniqueDatabaseName(prefix: string): string {
  counter += 1;
  return `${prefix}-${counter}-${Math.random().toString(36).slice(2)}`;
}
