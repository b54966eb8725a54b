import type { InstrumentEventKind, InstrumentEventRecord, InstrumentRecord, ReadingUnit, SiteRecord } from '../../core/archive/records.ts';
import { parseDateCell } from '../../core/formats/cells.ts';
import { parseSiteDescription, type SiteDescription } from '../../core/formats/site-description.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { countRejectedRows, countsOf, type ImportPlan } from './importReport.ts';

type Description = SiteDescription['instruments'][number];

const EVENT_KINDS: Readonly<Record<Description['events'][number]['kind'], InstrumentEventKind>> = {
  adjustment: 'adjustment', relevelling: 'relevelling', cleaning: 'cleaning', 'camera-change': 'camera-change',
  repair: 'other', collimation: 'recollimation', other: 'other',
};

function readingUnitOf(instrument: Description): { unit: ReadingUnit; scale: number; sense: 1 | -1 } {
  const z = instrument.zenithScale;
  if (z === null) return { unit: 'circle-arcsec', scale: 1, sense: 1 };
  return { unit: z.unit === 'turn' ? 'micrometer-turn' : 'pixel', scale: z.arcsecPerUnit, sense: z.sense };
}

/**
 * Validates a site/instrument description (FORMATS.md) and plans its writes: the site and each
 * instrument keep the file's ids, so importing the same file again updates them (an existing id
 * is an update, written at commit) instead of doubling them. Events get ids from instrument,
 * date, kind and position, so they too are updated rather than repeated. Wavelength µm → nm.
 */
export async function planSiteImport(database: ArchiveDatabase, bytes: Uint8Array, fileName: string, nowUtc: string): Promise<ImportPlan> {
  const parsed = parseSiteDescription(bytes, fileName);
  const description = parsed.rows[0];
  const created: Record<string, object[]> = { sites: [], instruments: [], instrumentEvents: [] };
  const updated: Record<string, object[]> = { sites: [], instruments: [], instrumentEvents: [] };
  if (description !== undefined) {
    const place = async (table: 'sites' | 'instruments' | 'instrumentEvents', row: { id: string; createdUtc: string }) => {
      const existing = await database.table(table).get(row.id);
      if (existing === undefined) created[table].push(row);
      else updated[table].push({ ...row, createdUtc: existing.createdUtc });
    };
    const s = description.site;
    const site: SiteRecord = {
      id: s.id, label: s.label, latitudeDeg: s.latitudeDeg, longitudeDeg: s.longitudeDeg, heightM: s.heightM, note: '',
      visibility: 'visible', createdUtc: nowUtc, updatedUtc: nowUtc,
    };
    await place('sites', site);
    for (const instrument of description.instruments) {
      const reading = readingUnitOf(instrument);
      const record: InstrumentRecord = {
        id: instrument.id, label: instrument.label, kind: instrument.kind, siteId: s.id, readingUnit: reading.unit,
        readingScaleArcsecPerUnit: reading.scale, readingSense: reading.sense, wireIntervalsEquatorialS: instrument.wireIntervalsS,
        effectiveWavelengthNm: instrument.effectiveWavelengthUm * 1000, clockLabel: instrument.clockId,
        note: `clock time scale: ${instrument.clockTimeScale}`, visibility: 'visible', createdUtc: nowUtc, updatedUtc: nowUtc,
        ...(instrument.camera === null ? {} : { camera: instrument.camera }),
      };
      await place('instruments', record);
      for (const [k, event] of instrument.events.entries()) {
        const day = parseDateCell(event.date);
        if (!day.ok) continue; // the parser already rejected such a file
        const row: InstrumentEventRecord = {
          id: `${instrument.id}:${event.date}:${event.kind}:${k}`, instrumentId: instrument.id, utcMjd: day.value,
          kind: EVENT_KINDS[event.kind], note: event.kind === 'repair' ? `repair: ${event.note}` : event.note,
          visibility: 'visible', createdUtc: nowUtc, updatedUtc: nowUtc,
        };
        await place('instrumentEvents', row);
      }
    }
  }
  const rejectedRowCount = countRejectedRows(parsed.rejected);
  return {
    report: {
      fileName, kind: 'site-description', totalRows: parsed.totalRows, validRows: parsed.rows.length, rejectedRowCount,
      rejected: parsed.rejected, duplicateCount: 0, warnings: parsed.warnings, missingPrerequisites: [],
      createdCounts: countsOf(created), updatedCounts: countsOf(updated),
    },
    writes: { created, updated },
  };
}
