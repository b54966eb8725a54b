import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readCsv } from '../../core/formats/csv.ts';
import { parseTransitLog } from '../../core/formats/transit-log.ts';
import { parseStarList } from '../../core/formats/star-list.ts';
import { parseSiteDescription } from '../../core/formats/site-description.ts';
import { parseNightReadings } from '../../core/formats/night-readings.ts';
import type { ParseResult } from '../../core/formats/parse-result.ts';

const RUNS = 1500;
const encoder = new TextEncoder();

/** A seed per run, printed so a failure can be replayed with the same seed. */
function seedFor(name: string): number {
  const seed = Number(process.env.FUZZ_SEED ?? Date.now() % 2_147_483_647);
  console.log(`fuzz ${name}: seed ${seed} (replay with FUZZ_SEED=${seed})`);
  return seed;
}

function checkInvariants<T extends { row: number }>(result: ParseResult<T>): void {
  const rejectedRows = new Set(result.rejected.filter((r) => r.row >= 1).map((r) => r.row));
  expect(result.rows.length + rejectedRows.size).toBe(result.totalRows);
  for (const r of result.rejected) {
    expect(Number.isInteger(r.row) && r.row >= 0 && r.row <= result.totalRows).toBe(true);
    expect(Number.isInteger(r.line) && r.line >= 0).toBe(true);
    expect(r.reason.length).toBeGreaterThan(0);
  }
  for (const row of result.rows) expect(rejectedRows.has(row.row)).toBe(false);
}

/** Serialises fields per RFC 4180, quoting when needed. */
function toCsv(records: string[][], newline: string): string {
  return records.map((fields) => fields.map((f) => (/[",\r\n]/.test(f) ? `"${f.replaceAll('"', '""')}"` : f)).join(',')).join(newline) + newline;
}

const transitCells = fc.constantFrom(
  'K-1', 'K-2', 'upper', 'lower', 'east', 'west', 'none', '', ' ', '12.5', '1,5', '-3e2', 'NaN', '1013', '5000', '95', '45',
  '2026-03-14T21:07:30Z', '2026-03-14T21:07:30', '2016-12-31T23:59:60Z', '2026-02-30T01:00:00Z', '75010;;75020', 'cloud', 'cloud;x',
  '"', 'a"b', '\n', 'é', '2026-03-14',
);
const transitHeaders = fc.shuffledSubarray(
  ['starId', 'culmination', 'clamp', 'wire1Utc', 'wire2Utc', 'wire1ClockS', 'wireTimesClockS', 'micrometerTurns', 'zenithDistanceDeg', 'pressureHpa', 'flags', 'note', 'extra', 'nightDate'],
  { minLength: 1 },
);
const starCells = fc.constantFrom('S-1', 'S-2', '', '10', '360', '-91', '45.5', '2016.0', '1799', 'abc', '0', '-5', '1e400', 'p1;p2', '"x"', '\r\n');
const starHeaders = fc.shuffledSubarray(
  ['id', 'label', 'raDeg', 'decDeg', 'epochJyear', 'pmRaCosDecMasYr', 'pmDecMasYr', 'parallaxMas', 'parallaxSigmaMas', 'positionSigmaMas', 'pmSigmaMasYr', 'radialVelocityKmS', 'magnitude', 'source', 'programme', 'oops'],
  { minLength: 1 },
);

const readingHeaders = fc.shuffledSubarray(['nightDate', 'utc', 'instrumentId', 'levelArcsec', 'collimationArcsec', 'oops'], { minLength: 1 });

/** Plausible values per column, so the accepting paths are reached as well as the rejecting ones. */
const VALID: Record<string, readonly string[]> = {
  starId: ['K-1'], culmination: ['upper', 'lower'], clamp: ['east', 'west', ''], wire1Utc: [''], wire2Utc: [''],
  wire1ClockS: ['75010.5', '80000'], wireTimesClockS: ['75010;;75020', '1.5'], micrometerTurns: ['12.5', ''], zenithDistanceDeg: ['', '45'],
  pressureHpa: ['1013', ''], flags: ['', 'cloud'], note: ['fine, "dry"', ''], extra: ['x'], nightDate: ['2026-03-14', ''],
  id: ['S-1', 'S-2', 'S-3'], label: ['a star'], raDeg: ['10', '359.9'], decDeg: ['45.5', '-89'], epochJyear: ['2016.0'],
  pmRaCosDecMasYr: ['-5', ''], pmDecMasYr: ['3'], parallaxMas: ['0.5', ''], parallaxSigmaMas: ['0.1'], positionSigmaMas: ['12', ''], pmSigmaMasYr: ['0.7'], radialVelocityKmS: ['-20'],
  magnitude: ['5'], source: ['invented'], programme: ['p1;p2'], oops: ['?'],
  utc: ['2026-03-14T21:00:00Z', '2026-03-15T03:30:00.5Z'], instrumentId: ['mt-1', ''], levelArcsec: ['1.25', '-0.8', ''], collimationArcsec: ['0.4', ''],
};

function tableArbitrary(headers: fc.Arbitrary<string[]>, cells: fc.Arbitrary<string>): fc.Arbitrary<string> {
  return headers.chain((header) => {
    const goodRow = fc.tuple(...header.map((name) => fc.oneof({ weight: 6, arbitrary: fc.constantFrom(...(VALID[name] ?? [''])) }, { weight: 1, arbitrary: cells })));
    const anyRow = fc.array(cells, { minLength: Math.max(0, header.length - 1), maxLength: header.length + 1 });
    const row = fc.oneof({ weight: 4, arbitrary: goodRow.map((r) => [...r]) }, { weight: 1, arbitrary: anyRow });
    return fc.tuple(fc.array(row, { maxLength: 12 }), fc.constantFrom('\n', '\r\n')).map(([rows, newline]) => toCsv([header, ...rows], newline));
  });
}

describe('fuzzing the readers (fast-check): no uncaught exception, accepted + rejected = total, every rejection has its row', () => {
  it(`readCsv round-trips any table of strings (${RUNS} cases)`, () => {
    const seed = seedFor('readCsv');
    fc.assert(
      fc.property(fc.array(fc.array(fc.string({ unit: 'grapheme' }), { minLength: 1, maxLength: 5 }), { minLength: 1, maxLength: 8 }), fc.constantFrom('\n', '\r\n'), (records, newline) => {
        // A record that is one empty field serialises to an empty line, which the reader skips (documented).
        const kept = records.filter((r) => !(r.length === 1 && r[0] === ''));
        const { records: read, problems } = readCsv(toCsv(kept, newline));
        expect(problems).toEqual([]);
        expect(read.map((r) => r.fields)).toEqual(kept);
      }),
      { numRuns: RUNS, seed },
    );
    fc.assert(fc.property(fc.string(), (text) => void readCsv(text)), { numRuns: RUNS, seed });
  });

  it(`parseTransitLog on random bytes and on structured tables (${RUNS} + ${RUNS} cases)`, () => {
    const seed = seedFor('parseTransitLog');
    const options = { fileName: 'fuzz.csv', knownStarIds: new Set(['K-1']), nightClockS: { start: 0, end: 100_000 } };
    fc.assert(fc.property(fc.uint8Array({ maxLength: 300 }), (b) => checkInvariants(parseTransitLog(b, options))), { numRuns: RUNS, seed });
    let accepted = 0;
    fc.assert(
      fc.property(tableArbitrary(transitHeaders, transitCells), (text) => {
        const result = parseTransitLog(encoder.encode(text), options);
        accepted += result.rows.length;
        checkInvariants(result);
      }),
      { numRuns: RUNS, seed },
    );
    // The generator must reach the accepting paths too, or the fuzzing proves little.
    expect(accepted).toBeGreaterThan(0);
  });

  it(`parseStarList on random bytes and on structured tables (${RUNS} + ${RUNS} cases)`, () => {
    const seed = seedFor('parseStarList');
    fc.assert(fc.property(fc.uint8Array({ maxLength: 300 }), (b) => checkInvariants(parseStarList(b, 'fuzz.csv'))), { numRuns: RUNS, seed });
    let accepted = 0;
    fc.assert(
      fc.property(tableArbitrary(starHeaders, starCells), (text) => {
        const result = parseStarList(encoder.encode(text), 'fuzz.csv');
        accepted += result.rows.length;
        checkInvariants(result);
      }),
      { numRuns: RUNS, seed },
    );
    expect(accepted).toBeGreaterThan(0);
  });

  it(`parseNightReadings on random bytes and on structured tables (${RUNS} + ${RUNS} cases)`, () => {
    const seed = seedFor('parseNightReadings');
    fc.assert(fc.property(fc.uint8Array({ maxLength: 300 }), (b) => checkInvariants(parseNightReadings(b, 'fuzz.csv'))), { numRuns: RUNS, seed });
    let accepted = 0;
    fc.assert(
      fc.property(tableArbitrary(readingHeaders, transitCells), (text) => {
        const result = parseNightReadings(encoder.encode(text), 'fuzz.csv');
        accepted += result.rows.length;
        checkInvariants(result);
      }),
      { numRuns: RUNS, seed },
    );
    expect(accepted).toBeGreaterThan(0);
  });

  it(`parseSiteDescription on random JSON and random bytes (${RUNS} + ${RUNS} cases)`, () => {
    const seed = seedFor('parseSiteDescription');
    const check = (b: Uint8Array): void => {
      const r = parseSiteDescription(b, 'fuzz.json');
      expect(r.rows.length + (r.rejected.some((x) => x.row === 1) ? 1 : 0)).toBe(r.totalRows);
      for (const x of r.rejected) expect(x.reason.length).toBeGreaterThan(0);
    };
    const mostly = <T,>(good: T, other: fc.Arbitrary<unknown>): fc.Arbitrary<unknown> => fc.oneof({ weight: 5, arbitrary: fc.constant(good) }, { weight: 1, arbitrary: other });
    const instrument = fc.record({
      id: fc.constantFrom('a', 'b', ''), label: mostly('T', fc.string()), kind: fc.constantFrom('transit', 'zenith-tube', 'fixed-camera', 'x'),
      wireIntervalsS: mostly([10, 0, -10], fc.array(fc.oneof(fc.double(), fc.string()))), effectiveWavelengthUm: mostly(0.55, fc.double()),
      clockId: mostly('c', fc.string()), clockTimeScale: fc.constantFrom('sidereal', 'mean-solar', 'solar'),
      events: mostly([{ date: '2025-01-02', kind: 'other', note: '' }], fc.array(fc.jsonValue(), { maxLength: 2 })),
    }, { requiredKeys: [] });
    const site = { id: 's', label: 'S', latitudeDeg: 47, longitudeDeg: 8, heightM: 600 };
    const doc = fc.record({ formatVersion: fc.constantFrom(1, 2), site: mostly(site, fc.jsonValue()), instruments: fc.array(instrument, { maxLength: 3 }) }, { requiredKeys: [] });
    let accepted = 0;
    fc.assert(
      fc.property(fc.oneof(doc, fc.jsonValue()), (v) => {
        const b = encoder.encode(JSON.stringify(v) ?? 'null');
        check(b);
        accepted += parseSiteDescription(b, 'fuzz.json').rows.length;
      }),
      { numRuns: RUNS, seed },
    );
    expect(accepted).toBeGreaterThan(0);
    fc.assert(fc.property(fc.uint8Array({ maxLength: 200 }), check), { numRuns: RUNS, seed });
  });
});
