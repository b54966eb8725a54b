import type { InstrumentEventKind, InstrumentEventRecord, InstrumentRecord, SiteRecord } from '../archive/records.ts';
import { parseUtcCell } from '../formats/utc-instant.ts';
import { parseSiteDescription, type InstrumentEvent } from '../formats/site-description.ts';
import { decodeUtf8 } from '../formats/utf8.ts';
import { dateMjd, dateText, type FolderRejection, utcInstantMjd, utcText } from './folder-text.ts';

/** Keys this folder adds to the site description; the general importer ignores them (FOLDER.md). */
export const SITE_EXTENSION_KEYS = ['note', 'id', 'utc', 'recordKind'] as const;
const REPAIR_PREFIX = 'repair — ';

type FileEventKind = InstrumentEvent['kind'];
const TO_FILE: Record<InstrumentEventKind, FileEventKind> = {
  adjustment: 'adjustment', relevelling: 'relevelling', recollimation: 'collimation', cleaning: 'cleaning',
  'camera-change': 'camera-change', 'clock-change': 'other', other: 'other',
};

/** The records of one site as the site description (H4's `site.json`, FORMATS.md) plus our extension keys. */
export function writeSiteFile(site: SiteRecord, instruments: readonly InstrumentRecord[], events: readonly InstrumentEventRecord[]): string {
  const document = {
    formatVersion: 1,
    site: { id: site.id, label: site.label, latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, heightM: site.heightM, note: site.note },
    instruments: instruments.map((instrument) => {
      if (instrument.siteId !== site.id) throw new RangeError(`site.json: instrument ${instrument.id} belongs to site ${instrument.siteId}, not ${site.id}; one folder holds one site`);
      return {
        id: instrument.id, label: instrument.label, kind: instrument.kind,
        zenithScale: zenithScaleOf(instrument),
        wireIntervalsS: instrument.wireIntervalsEquatorialS,
        effectiveWavelengthUm: Number(`${instrument.effectiveWavelengthNm}e-3`),
        clockId: instrument.clockLabel, clockTimeScale: 'mean-solar', note: instrument.note,
        ...(instrument.kind === 'fixed-camera' ? { camera: instrument.camera } : {}),
        events: events.filter((e) => e.instrumentId === instrument.id).sort((a, b) => a.utcMjd - b.utcMjd).map(eventEntry),
      };
    }),
  };
  const orphan = events.find((e) => !instruments.some((i) => i.id === e.instrumentId));
  if (orphan !== undefined) throw new RangeError(`site.json: event ${orphan.id} names instrument ${orphan.instrumentId}, which is not in the archive`);
  return `${JSON.stringify(document, null, 2)}\n`;
}

function zenithScaleOf(instrument: InstrumentRecord): { unit: 'turn' | 'pixel'; arcsecPerUnit: number; sense: 1 | -1 } | null {
  if (instrument.kind === 'fixed-camera' && instrument.camera === undefined) {
    throw new RangeError(`site.json: instrument ${instrument.id} is a fixed camera without its camera geometry (InstrumentRecord.camera); add orientation, parity, optical centre and reference column`);
  }
  if (instrument.readingUnit === 'circle-arcsec') {
    if (instrument.readingScaleArcsecPerUnit !== 1 || instrument.readingSense !== 1) throw new RangeError(`site.json: instrument ${instrument.id} reads a circle in arcseconds with scale ${instrument.readingScaleArcsecPerUnit} and sense ${instrument.readingSense}; a circle reading must have scale 1 and sense +1`);
    return null;
  }
  return { unit: instrument.readingUnit === 'pixel' ? 'pixel' : 'turn', arcsecPerUnit: instrument.readingScaleArcsecPerUnit, sense: instrument.readingSense };
}

function eventEntry(event: InstrumentEventRecord): Record<string, string> {
  const kind = TO_FILE[event.kind];
  const repair = event.kind === 'other' && event.note.startsWith(REPAIR_PREFIX);
  const entry: Record<string, string> = {
    date: dateText(Math.floor(event.utcMjd)), kind: repair ? 'repair' : kind, note: repair ? event.note.slice(REPAIR_PREFIX.length) : event.note,
    id: event.id, utc: utcText(event.utcMjd),
  };
  if (event.kind === 'clock-change') entry.recordKind = 'clock-change';
  return entry;
}

export interface SiteFileContent {
  readonly site: SiteRecord | null;
  readonly instruments: InstrumentRecord[];
  readonly events: InstrumentEventRecord[];
  readonly rejected: FolderRejection[];
  readonly warnings: string[];
}

/** Reads `site.json` with H4's parser, then our extension keys; `audit` stamps the records. */
export function readSiteFile(bytes: Uint8Array, file: string, audit: { createdUtc: string }): SiteFileContent {
  const parsed = parseSiteDescription(bytes, file);
  const rejected: FolderRejection[] = parsed.rejected.map((r) => ({ file, ...r }));
  const warnings = parsed.warnings.filter((w) => !onlyExtensionKeys(w));
  const description = parsed.rows[0];
  if (description === undefined) return { site: null, instruments: [], events: [], rejected, warnings };
  const decoded = decodeUtf8(bytes);
  if (!decoded.ok) return { site: null, instruments: [], events: [], rejected, warnings };
  const raw = JSON.parse(decoded.text) as { site: { note?: unknown }; instruments: { note?: unknown; events?: { id?: unknown; utc?: unknown; recordKind?: unknown }[] }[] };
  const stamp = { visibility: 'visible' as const, createdUtc: audit.createdUtc, updatedUtc: audit.createdUtc };
  const text = (value: unknown): string => (typeof value === 'string' ? value : '');
  const s = description.site;
  const site: SiteRecord = { id: s.id, label: s.label, latitudeDeg: s.latitudeDeg, longitudeDeg: s.longitudeDeg, heightM: s.heightM, note: text(raw.site.note), ...stamp };
  const instruments: InstrumentRecord[] = [];
  const events: InstrumentEventRecord[] = [];
  description.instruments.forEach((d, k) => {
    const pointer = `/instruments/${k}`;
    if (d.clockTimeScale !== 'mean-solar') {
      rejected.push({ file, row: 1, line: 0, column: `${pointer}/clockTimeScale`, reason: 'a sidereal clock cannot be kept in the archive records yet (they assume a mean-solar clock); convert the times or ask for sidereal-clock support' });
      return;
    }
    const scale = d.zenithScale;
    instruments.push({
      id: d.id, label: d.label, kind: d.kind, siteId: s.id,
      readingUnit: scale === null ? 'circle-arcsec' : scale.unit === 'pixel' ? 'pixel' : 'micrometer-turn',
      readingScaleArcsecPerUnit: scale === null ? 1 : scale.arcsecPerUnit, readingSense: scale === null ? 1 : scale.sense,
      wireIntervalsEquatorialS: d.wireIntervalsS, effectiveWavelengthNm: Number(`${d.effectiveWavelengthUm}e3`),
      clockLabel: d.clockId, note: text(raw.instruments[k].note), ...stamp,
      ...(d.camera === null ? {} : { camera: d.camera }),
    });
    d.events.forEach((e, n) => {
      const extra = raw.instruments[k].events?.[n] ?? {};
      const at = typeof extra.utc === 'string' ? parseUtcCell(extra.utc) : null;
      if (at !== null && !at.ok) rejected.push({ file, row: 1, line: 0, column: `${pointer}/events/${n}/utc`, reason: at.reason });
      const utcMjd = at?.ok ? utcInstantMjd(at.value) : dateMjd(e.date) + 0.5;
      const kind: InstrumentEventKind = extra.recordKind === 'clock-change' ? 'clock-change' : e.kind === 'collimation' ? 'recollimation' : e.kind === 'repair' ? 'other' : e.kind;
      const note = e.kind === 'repair' ? `${REPAIR_PREFIX}${e.note}` : e.note;
      events.push({ id: typeof extra.id === 'string' ? extra.id : `${d.id}-event-${n + 1}`, instrumentId: d.id, utcMjd, kind, note, ...stamp });
    });
  });
  return { site, instruments, events, rejected, warnings };
}

/** True for H4's "unknown key(s) ignored" warning when it lists only our extension keys. */
function onlyExtensionKeys(warning: string): boolean {
  const match = /: unknown key\(s\) ignored: (.*)$/.exec(warning);
  return match !== null && match[1].split(', ').every((key) => (SITE_EXTENSION_KEYS as readonly string[]).includes(key));
}
