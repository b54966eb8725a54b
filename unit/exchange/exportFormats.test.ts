import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import type { StarRecord, TransitRecord } from '../../core/archive/records.ts';
import { readCsv } from '../../core/formats/csv.ts';
import { parseStarList } from '../../core/formats/star-list.ts';
import { archiveTableCsv } from '../../core/exchange-formats/archive-table-csv.ts';
import { SOLVE_STAR_COLUMNS } from '../../core/exchange-formats/solve-star-columns.ts';
import { escapeXml, writeVoTable } from '../../core/exchange-formats/votable-writer.ts';
import { writeCsvTable } from '../../core/exchange-formats/export-columns.ts';
import type { StarResult } from '../../core/joint/solve-archive.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';

// Invented stars (no real catalogue values): only the round trip matters.
const audit = { visibility: 'visible' as const, createdUtc: '2026-03-01T00:00:00.000Z', updatedUtc: '2026-03-01T00:00:00.000Z' };
const STARS: StarRecord[] = [
  { ...audit, id: 'a1', catalogueId: 'QX-1', label: 'Invented, "one"', raDeg: 84.1234567890123, decDeg: -22.4411, catalogueEpochJulianYear: 2016, pmRaMasYr: -1.25, pmDecMasYr: 0.1 + 0.2, parallaxMas: 4.125, parallaxErrorMas: 0.02, radialVelocityKmS: -12.5, magnitude: 5.5, source: 'invented', programmes: ['clock', 'latitude'] },
  { ...audit, id: 'a2', catalogueId: 'QX-2', label: 'Zweiter Stern – ü', raDeg: 0, decDeg: 89.9, catalogueEpochJulianYear: 2000, pmRaMasYr: 1e-7, pmDecMasYr: -0, parallaxMas: 0.001, parallaxErrorMas: 0, radialVelocityKmS: 0, magnitude: null, source: 'line\nbreak', programmes: [] },
];

const RESULTS: StarResult[] = [
  { id: 'QX-1', observations: 120, parallaxMas: 4.1234567, parallaxSigmaMas: 0.31, pmRaMasYr: -1.2, pmRaSigmaMasYr: 0.05, pmDecMasYr: 1 / 3, pmDecSigmaMasYr: 0.07, deltaRaMas: 12.5, deltaRaSigmaMas: 1.5, deltaDecMas: -3, deltaDecSigmaMas: 2 },
  { id: 'A&B <x>', observations: 7, parallaxMas: null, parallaxSigmaMas: null, pmRaMasYr: 2e-12, pmRaSigmaMasYr: 0.5, pmDecMasYr: -0.5, pmDecSigmaMasYr: 0.5, deltaRaMas: null, deltaRaSigmaMas: null, deltaDecMas: null, deltaDecSigmaMas: null },
];

describe('archiveTableCsv(stars) reads back through the star-list parser (core/formats/star-list.ts)', () => {
  it('every value returns bit for bit, unknowns as null', () => {
    const csv = archiveTableCsv('stars', STARS);
    const parsed = parseStarList(encodeUtf8(csv), 'stars.csv');
    expect(parsed.rejected).toEqual([]);
    expect(parsed.warnings).toEqual(['stars.csv: unknown column(s) ignored: archiveId']);
    expect(parsed.rows.map((r) => r.id)).toEqual(['QX-1', 'QX-2']);
    const [one, two] = parsed.rows;
    expect(Object.is(one.raDeg, 84.1234567890123)).toBe(true);
    expect(Object.is(one.pmDecMasYr, 0.1 + 0.2)).toBe(true);
    expect(one.label).toBe('Invented, "one"');
    expect(one.programmes).toEqual(['clock', 'latitude']);
    expect(one.radialVelocityKmS).toBe(-12.5);
    expect(Object.is(two.pmDecMasYr, -0)).toBe(true);
    expect(two.pmRaCosDecMasYr).toBe(1e-7);
    expect(two.parallaxSigmaMas).toBeNull();
    expect(two.radialVelocityKmS).toBeNull();
    expect(two.magnitude).toBeNull();
    expect(two.source).toBe('line\nbreak');
  });

  it("writes the star import's NaN (unknown) as empty cells that read back as null", () => {
    const unknown = { ...STARS[0], pmRaMasYr: Number.NaN, pmDecMasYr: Number.NaN, parallaxMas: Number.NaN, parallaxErrorMas: Number.NaN };
    const [row] = parseStarList(encodeUtf8(archiveTableCsv('stars', [unknown])), 'stars.csv').rows;
    expect([row.pmRaCosDecMasYr, row.pmDecMasYr, row.parallaxMas, row.parallaxSigmaMas]).toEqual([null, null, null, null]);
  });

  it('is RFC 4180: CRLF after every record, the quoted line break kept inside its field', () => {
    const csv = archiveTableCsv('stars', STARS);
    expect(csv.endsWith('\r\n')).toBe(true);
    expect(csv.split('\r\n')).toHaveLength(4); // header, two records, the empty rest after the last CRLF
    expect(csv).toContain('"line\nbreak"');
  });
});

describe('archiveTableCsv(transits)', () => {
  const transit: TransitRecord = { ...audit, id: 't1', nightId: 'n1', starId: 'a1', instrumentId: 'i1', culmination: 'upper', clockMjd: 61100.87654321012, wireClockMjd: [61100.8763, 61100.8767], utcMjd: 61100.8765, zenithReadings: [12.5, -0.25], weather: null, weight: 1, userRejected: false, flaggedOutlier: true, note: '' };
  it('writes units in the header names and numbers that parse back to the same doubles', () => {
    const { records, problems } = readCsv(archiveTableCsv('transits', [transit]));
    expect(problems).toEqual([]);
    const [header, row] = records.map((r) => r.fields);
    expect(header).toContain('clockMjd');
    expect(header).toContain('pressureHpa');
    const cell = (name: string): string => row[header.indexOf(name)];
    expect(Number(cell('clockMjd'))).toBe(transit.clockMjd);
    expect(cell('wireClockMjd').split(';').map(Number)).toEqual(transit.wireClockMjd);
    expect(cell('temperatureC')).toBe('');
    expect(cell('flaggedOutlier')).toBe('true');
  });
  it('refuses NaN with the table, row and column named', () => {
    expect(() => archiveTableCsv('transits', [{ ...transit, weight: Number.NaN }])).toThrow(/transits row 1, column weight/);
  });
});

/** Minimal XML well-formedness: balanced, properly nested tags; returns the element names opened, in order. */
function checkedElements(xml: string): string[] {
  const stack: string[] = [];
  const opened: string[] = [];
  const body = xml.replace(/^<\?xml[^?]*\?>\s*/, '');
  for (const match of body.matchAll(/<(\/?)([A-Za-z_][\w.-]*)((?:\s+[\w:.-]+="[^"<]*")*)\s*(\/?)>/g)) {
    const [, closing, name, , selfClosing] = match;
    if (closing === '/') {
      if (stack.pop() !== name) throw new Error(`</${name}> closes the wrong element`);
    } else {
      opened.push(name);
      if (selfClosing !== '/') stack.push(name);
    }
  }
  if (stack.length > 0) throw new Error(`unclosed elements: ${stack.join(', ')}`);
  if (/&(?!(amp|lt|gt|quot|apos);)/.test(body)) throw new Error('a bare & outside an entity reference');
  return opened;
}

describe('writeVoTable(solve stars) — VOTable 1.4 (IVOA)', () => {
  const xml = writeVoTable({ resourceName: 'meridian-ledger-solve', tableName: 'stars', description: 'joint solve <test> & check' }, SOLVE_STAR_COLUMNS, RESULTS);

  it('is well-formed with one FIELD per column and one TR per row (minimal checker)', () => {
    const elements = checkedElements(xml);
    expect(elements.filter((e) => e === 'FIELD')).toHaveLength(SOLVE_STAR_COLUMNS.length);
    expect(elements.filter((e) => e === 'TR')).toHaveLength(RESULTS.length);
    expect(elements.filter((e) => e === 'TD')).toHaveLength(RESULTS.length * SOLVE_STAR_COLUMNS.length);
    expect(elements.slice(0, 3)).toEqual(['VOTABLE', 'RESOURCE', 'TABLE']);
  });

  it('parses in Python\'s xml.etree (an XML parser outside the project) with units, UCDs and values intact', () => {
    const script = [
      'import sys, json, xml.etree.ElementTree as ET',
      'ns = {"v": "http://www.ivoa.net/xml/VOTable/v1.3"}',
      'root = ET.fromstring(sys.stdin.buffer.read())',
      'fields = [dict(f.attrib) for f in root.iter("{%s}FIELD" % ns["v"])]',
      'rows = [[td.text or "" for td in tr] for tr in root.iter("{%s}TR" % ns["v"])]',
      'print(json.dumps({"version": root.get("version"), "fields": fields, "rows": rows}))',
    ].join('\n');
    const out = JSON.parse(execFileSync('/usr/bin/python3', ['-c', script], { input: xml }).toString()) as { version: string; fields: Record<string, string>[]; rows: string[][] };
    expect(out.version).toBe('1.4');
    const byName = new Map(out.fields.map((f) => [f.name, f]));
    expect(byName.get('parallaxMas')).toMatchObject({ datatype: 'double', unit: 'mas', ucd: 'pos.parallax' });
    expect(byName.get('pmRaMasYr')).toMatchObject({ unit: 'mas/yr', ucd: 'pos.pm;pos.eq.ra' });
    expect(out.rows[1][0]).toBe('A&B <x>');
    for (const [k, star] of RESULTS.entries()) {
      for (const [c, column] of SOLVE_STAR_COLUMNS.entries()) {
        const cell = out.rows[k][c];
        const want = column.value(star);
        if (want === null) expect(cell).toBe('');
        else if (typeof want === 'number') expect(Number(cell)).toBe(want);
      }
    }
  });

  it('refuses a character XML 1.0 cannot hold, naming where', () => {
    expect(() => escapeXml('bell\u0007', 'TD x')).toThrow(/TD x: character U\+0007 at position 4/);
  });

  it('the same table as CSV has the same cells', () => {
    const { records } = readCsv(writeCsvTable('stars', SOLVE_STAR_COLUMNS, RESULTS));
    expect(records[0].fields).toEqual(SOLVE_STAR_COLUMNS.map((c) => c.name));
    expect(Number(records[1].fields[6])).toBe(1 / 3);
    expect(records[2].fields[2]).toBe('');
  });
});
