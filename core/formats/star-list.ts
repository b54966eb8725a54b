import { parseNumberCell } from './cells.ts';
import { readCsvTable, unusableHeader } from './csv-table.ts';
import type { TableRow } from './csv-table.ts';
import type { ParseResult, Rejection } from './parse-result.ts';

/** One star of the list: ICRS place at a catalogue epoch; unknown optional values are null. */
export interface StarListRow {
  readonly row: number;
  readonly line: number;
  readonly id: string;
  readonly label: string;
  readonly raDeg: number;
  readonly decDeg: number;
  /** Epoch of the position (Julian year, TDB), e.g. 2016.0 for Gaia DR3. */
  readonly epochJyear: number;
  /** Proper motion in right ascension times cos δ (mas/yr). */
  readonly pmRaCosDecMasYr: number | null;
  readonly pmDecMasYr: number | null;
  readonly parallaxMas: number | null;
  readonly parallaxSigmaMas: number | null;
  /**
   * Stated 1σ of the catalogue position at its epoch, per coordinate on the sky (mas), and of each
   * proper-motion component (mas/yr); the joint solve's catalogue priors (SOLVE.md). Absent or
   * null: unknown (rows built before the columns existed have neither).
   */
  readonly positionSigmaMas?: number | null;
  readonly pmSigmaMasYr?: number | null;
  readonly radialVelocityKmS: number | null;
  readonly magnitude: number | null;
  readonly source: string;
  /** Programmes the star belongs to (';'-separated in the file). */
  readonly programmes: readonly string[];
}

const REQUIRED = ['id', 'raDeg', 'decDeg', 'epochJyear'] as const;
const OPTIONAL_NUMBERS = [
  ['pmRaCosDecMasYr', 'mas/yr', -20_000, 20_000],
  ['pmDecMasYr', 'mas/yr', -20_000, 20_000],
  ['parallaxMas', 'mas', -100, 1_000],
  ['parallaxSigmaMas', 'mas', 0, 1_000],
  ['positionSigmaMas', 'mas', 0, 100_000],
  ['pmSigmaMasYr', 'mas/yr', 0, 10_000],
  ['radialVelocityKmS', 'km/s', -1_000, 1_000],
  ['magnitude', 'mag', -2, 25],
] as const;
const PRIOR_SIGMA_COLUMNS = new Set<string>(['positionSigmaMas', 'pmSigmaMasYr']);
const KNOWN = new Set<string>([...REQUIRED, ...OPTIONAL_NUMBERS.map((o) => o[0]), 'label', 'source', 'programme']);

type Problems = { column: string; reason: string }[];

function parseStar(row: TableRow, problems: Problems): StarListRow | null {
  const get = (name: string): string => row.cells.get(name) ?? '';
  const required = (name: string, unit: string, min: number, max: number): number | null => {
    const r = parseNumberCell(get(name), unit, min, max);
    if (r.ok) return r.value;
    problems.push({ column: name, reason: r.reason });
    return null;
  };
  const id = get('id').trim();
  if (id === '') problems.push({ column: 'id', reason: 'empty star id' });
  const raDeg = required('raDeg', 'degrees of right ascension', 0, 360);
  if (raDeg === 360) problems.push({ column: 'raDeg', reason: 'right ascension 360° — write 0' });
  const decDeg = required('decDeg', 'degrees of declination', -90, 90);
  const epochJyear = required('epochJyear', 'Julian years', 1800, 2200);
  const optional: Record<string, number | null> = {};
  for (const [name, unit, min, max] of OPTIONAL_NUMBERS) {
    const text = get(name);
    if (text.trim() === '') optional[name] = null;
    else {
      const r = parseNumberCell(text, unit, min, max);
      optional[name] = r.ok ? r.value : null;
      if (!r.ok) problems.push({ column: name, reason: r.reason });
    }
  }
  for (const column of ['parallaxSigmaMas', 'positionSigmaMas', 'pmSigmaMasYr']) {
    if (optional[column] === 0) problems.push({ column, reason: 'a standard error of 0 is impossible; leave it empty if unknown' });
  }
  if (problems.length > 0 || raDeg === null || decDeg === null || epochJyear === null) return null;
  const programmes = get('programme').split(';').map((p) => p.trim()).filter((p) => p !== '');
  return {
    row: row.row, line: row.line, id, label: get('label').trim(), raDeg, decDeg, epochJyear,
    pmRaCosDecMasYr: optional.pmRaCosDecMasYr, pmDecMasYr: optional.pmDecMasYr, parallaxMas: optional.parallaxMas,
    parallaxSigmaMas: optional.parallaxSigmaMas, positionSigmaMas: optional.positionSigmaMas, pmSigmaMasYr: optional.pmSigmaMasYr, radialVelocityKmS: optional.radialVelocityKmS, magnitude: optional.magnitude,
    source: get('source').trim(), programmes,
  };
}

/**
 * Parses a star list CSV (layout in FORMATS.md): required id, raDeg [0, 360), decDeg [−90, 90],
 * epochJyear; optional proper motions (μα·cos δ and μδ, mas/yr), parallax and its sigma (mas),
 * the stated σ of the position (mas) and of the proper motion (mas/yr), radial velocity (km/s), magnitude, source and programme. Ranges are the physically possible
 * ones (the largest known proper motion is 10.4″/yr, Barnard's star, so |μ| ≤ 20″/yr). Duplicate ids
 * are rejected (the later row). Missing optional columns are named in a warning (except the two
 * stated σ), unknown columns too.
 */
export function parseStarList(bytes: Uint8Array, fileName: string): ParseResult<StarListRow> {
  const table = readCsvTable(bytes, fileName);
  const unusable = unusableHeader(table, REQUIRED);
  if (unusable !== null) return unusable;
  const rejected: Rejection[] = [...table.rejected];
  const warnings: string[] = [];
  // The stated position and proper-motion σ are extras for the joint solve's priors: most lists lack them, so their absence is not worth a warning.
  const absent = OPTIONAL_NUMBERS.map((o) => o[0]).filter((name) => !table.header.includes(name) && !PRIOR_SIGMA_COLUMNS.has(name));
  if (absent.length > 0) warnings.push(`${fileName}: column(s) ${absent.join(', ')} absent: those values are unknown (null), not zero`);
  const unknown = table.header.filter((name) => !KNOWN.has(name));
  if (unknown.length > 0) warnings.push(`${fileName}: unknown column(s) ignored: ${unknown.join(', ')}`);
  const rows: StarListRow[] = [];
  const byId = new Map<string, number>();
  for (const tableRow of table.rows) {
    const problems: Problems = [];
    const star = parseStar(tableRow, problems);
    if (star) {
      const earlier = byId.get(star.id);
      if (earlier !== undefined) problems.push({ column: 'id', reason: `duplicate star id '${star.id}' (first on row ${earlier})` });
      else {
        byId.set(star.id, star.row);
        rows.push(star);
      }
    }
    for (const p of problems) rejected.push({ row: tableRow.row, line: tableRow.line, column: p.column, reason: p.reason });
  }
  return { rows, rejected, warnings, totalRows: table.totalRows };
}
