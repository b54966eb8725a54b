import type { ReductionRecord } from '../archive/records.ts';
import type { StarResult } from '../joint/solve-archive.ts';
import type { ExportColumn } from './export-columns.ts';

const result = (name: keyof StarResult & string, unit: string, description: string, ucd?: string): ExportColumn<StarResult> => ({
  name, datatype: 'double', unit, description, value: (s) => s[name] as number | null, ...(ucd === undefined ? {} : { ucd }),
});

/**
 * Columns of a solve's star table (core/joint's StarResult): absolute values with 1σ formal errors,
 * empty where the term was not estimated. Units in VOTable form ("mas", "mas/yr"). UCDs are the
 * IVOA UCD1+ words as we recall them (from memory: pos.parallax, pos.pm;pos.eq.ra, stat.error;…;
 * checked against no list here); the position corrections get none, no standard word fits them.
 */
export const SOLVE_STAR_COLUMNS: readonly ExportColumn<StarResult>[] = [
  { name: 'id', datatype: 'char', description: "the star's id", ucd: 'meta.id;meta.main', value: (s) => s.id },
  { name: 'observations', datatype: 'int', description: 'transits used', ucd: 'meta.number', value: (s) => s.observations },
  result('parallaxMas', 'mas', 'annual parallax', 'pos.parallax'),
  result('parallaxSigmaMas', 'mas', 'formal 1-sigma error of the parallax', 'stat.error;pos.parallax'),
  result('pmRaMasYr', 'mas/yr', 'proper motion in right ascension times cos(dec)', 'pos.pm;pos.eq.ra'),
  result('pmRaSigmaMasYr', 'mas/yr', 'formal 1-sigma error of pmRaMasYr', 'stat.error;pos.pm;pos.eq.ra'),
  result('pmDecMasYr', 'mas/yr', 'proper motion in declination', 'pos.pm;pos.eq.dec'),
  result('pmDecSigmaMasYr', 'mas/yr', 'formal 1-sigma error of pmDecMasYr', 'stat.error;pos.pm;pos.eq.dec'),
  result('deltaRaMas', 'mas', 'correction to the catalogue right ascension times cos(dec) at its epoch'),
  result('deltaRaSigmaMas', 'mas', 'formal 1-sigma error of deltaRaMas'),
  result('deltaDecMas', 'mas', 'correction to the catalogue declination at its epoch'),
  result('deltaDecSigmaMas', 'mas', 'formal 1-sigma error of deltaDecMas'),
];

const NUMBER_FIELDS = SOLVE_STAR_COLUMNS.slice(2).map((c) => c.name);

/**
 * The star table of a saved solve (`results.stars`, written by the solve as StarResult rows),
 * checked field by field. Throws with the reduction, the row and the field named when the record
 * holds something else (an older or foreign solve), rather than exporting a wrong table.
 */
export function solveStarsOf(reduction: ReductionRecord): StarResult[] {
  const stars = reduction.results.stars;
  const where = `reduction "${reduction.label}" (${reduction.id})`;
  if (!Array.isArray(stars)) throw new TypeError(`${where} has no star table (results.stars); re-run the solve to save one`);
  return stars.map((row: unknown, k): StarResult => {
    const r = row as Record<string, unknown>;
    if (typeof r !== 'object' || r === null || typeof r.id !== 'string' || !Number.isInteger(r.observations)) {
      throw new TypeError(`${where}: star row ${k + 1} lacks a string id or an integer observations count`);
    }
    for (const name of NUMBER_FIELDS) {
      const v = r[name];
      if (!(v === null || (typeof v === 'number' && Number.isFinite(v)))) throw new TypeError(`${where}: star ${r.id} field ${name} is ${String(v)}, not a finite number or null`);
    }
    return r as unknown as StarResult;
  });
}
