import type { StarRecord } from '../archive/records.ts';
import { parseStarList, type StarListRow } from '../formats/star-list.ts';
import { csvFile, type FolderRejection, numberText } from './folder-text.ts';

const HEADER = ['id', 'label', 'raDeg', 'decDeg', 'epochJyear', 'pmRaCosDecMasYr', 'pmDecMasYr', 'parallaxMas', 'parallaxSigmaMas', 'positionSigmaMas', 'pmSigmaMasYr', 'radialVelocityKmS', 'magnitude', 'source', 'programme'];

/**
 * The programme stars as H4's star list (FORMATS.md). The list has one id column: it carries the
 * record's `catalogueId`, and a star read back gets `id` = `catalogueId` (so records whose two ids
 * differ are refused here, with the star named). A radial velocity of 0 and a parallax error of 0
 * (or NaN) mean "unknown" in the records and are written as empty cells.
 */
export function writeStarFile(stars: readonly StarRecord[]): string {
  const rows = stars.map((star) => {
    const where = `stars.csv: star ${star.id}`;
    if (star.id !== star.catalogueId) throw new RangeError(`${where} has catalogue id ${star.catalogueId}; the star list holds one id, so both must be equal`);
    if (star.programmes.some((p) => p.includes(';'))) throw new RangeError(`${where}: a programme name may not contain ';' (the list separator)`);
    return [
      star.catalogueId, star.label, numberText(star.raDeg, where), numberText(star.decDeg, where), numberText(star.catalogueEpochJulianYear, where),
      numberText(star.pmRaMasYr, where), numberText(star.pmDecMasYr, where), numberText(star.parallaxMas, where),
      // 0 is the records' "unknown"; NaN is how imports before 2026-12-02 stored it: unknown too.
      star.parallaxErrorMas === 0 || Number.isNaN(star.parallaxErrorMas) ? '' : numberText(star.parallaxErrorMas, where),
      star.positionErrorMas === undefined ? '' : numberText(star.positionErrorMas, where),
      star.pmErrorMasYr === undefined ? '' : numberText(star.pmErrorMasYr, where),
      star.radialVelocityKmS === 0 ? '' : numberText(star.radialVelocityKmS, where),
      star.magnitude === null ? '' : numberText(star.magnitude, where), star.source, star.programmes.join(';'),
    ];
  });
  return csvFile(HEADER, rows);
}

/** The row's stated position and proper-motion σ as record fields, left out when unknown. */
export function statedErrors(row: StarListRow): Pick<StarRecord, 'positionErrorMas' | 'pmErrorMasYr'> {
  return {
    ...(row.positionSigmaMas == null ? {} : { positionErrorMas: row.positionSigmaMas }),
    ...(row.pmSigmaMasYr == null ? {} : { pmErrorMasYr: row.pmSigmaMasYr }),
  };
}

/**
 * Reads the star list with H4's parser. Unknown proper motion or parallax (empty cells) become 0
 * with a warning naming the stars, since the records hold numbers; unknown radial velocity and
 * parallax error become 0, the records' "unknown".
 */
export function readStarFile(bytes: Uint8Array, file: string, audit: { createdUtc: string }): { stars: StarRecord[]; rejected: FolderRejection[]; warnings: string[] } {
  const parsed = parseStarList(bytes, file);
  const rejected = parsed.rejected.map((r) => ({ file, ...r }));
  const warnings = [...parsed.warnings];
  const assumedZero: string[] = [];
  const stars = parsed.rows.map((row): StarRecord => {
    if (row.pmRaCosDecMasYr === null || row.pmDecMasYr === null || row.parallaxMas === null) assumedZero.push(row.id);
    return {
      id: row.id, catalogueId: row.id, label: row.label, raDeg: row.raDeg, decDeg: row.decDeg, catalogueEpochJulianYear: row.epochJyear,
      pmRaMasYr: row.pmRaCosDecMasYr ?? 0, pmDecMasYr: row.pmDecMasYr ?? 0, parallaxMas: row.parallaxMas ?? 0,
      parallaxErrorMas: row.parallaxSigmaMas ?? 0, ...statedErrors(row), radialVelocityKmS: row.radialVelocityKmS ?? 0, magnitude: row.magnitude,
      source: row.source, programmes: row.programmes,
      visibility: 'visible', createdUtc: audit.createdUtc, updatedUtc: audit.createdUtc,
    };
  });
  if (assumedZero.length > 0) warnings.push(`${file}: proper motion or parallax unknown for ${assumedZero.join(', ')}; taken as 0 in the archive (fill them in if they are known)`);
  return { stars, rejected, warnings };
}
