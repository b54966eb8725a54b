import { parseDateCell } from './cells.ts';
import { JsonChecker } from './json-checks.ts';
import type { ParseResult, Rejection } from './parse-result.ts';
import { decodeUtf8 } from './utf8.ts';

export const INSTRUMENT_KINDS = ['transit', 'zenith-tube', 'fixed-camera'] as const;
export const INSTRUMENT_EVENT_KINDS = ['adjustment', 'relevelling', 'cleaning', 'camera-change', 'repair', 'collimation', 'other'] as const;

/** Site: geodetic coordinates on WGS84, longitude east positive. */
export interface SiteRecord {
  readonly id: string;
  readonly label: string;
  readonly latitudeDeg: number;
  readonly longitudeDeg: number;
  readonly heightM: number;
}

/** An instrument event; events cut the drift model into segments. */
export interface InstrumentEvent {
  readonly date: string;
  readonly kind: (typeof INSTRUMENT_EVENT_KINDS)[number];
  readonly note: string;
}

export interface InstrumentRecord {
  readonly id: string;
  readonly label: string;
  readonly kind: (typeof INSTRUMENT_KINDS)[number];
  /** Micrometer (arcsec per turn) or detector (arcsec per pixel) scale; sense +1 when readings increase with z. */
  readonly zenithScale: { readonly unit: 'turn' | 'pixel'; readonly arcsecPerUnit: number; readonly sense: 1 | -1 } | null;
  /** Equatorial wire intervals from the mean wire (s of time), clamp west, positive = crossed first. */
  readonly wireIntervalsS: readonly number[];
  readonly effectiveWavelengthUm: number;
  readonly clockId: string;
  readonly clockTimeScale: 'sidereal' | 'mean-solar';
  readonly camera: { readonly orientationDeg: number; readonly parity: 1 | -1; readonly opticalCentrePx: readonly [number, number]; readonly referenceColumnPx: number } | null;
  readonly events: readonly InstrumentEvent[];
}

export interface SiteDescription {
  readonly formatVersion: 1;
  readonly site: SiteRecord;
  readonly instruments: readonly InstrumentRecord[];
}

function checkSite(check: JsonChecker, value: unknown): SiteRecord | null {
  const o = check.object(value, '/site', ['id', 'label', 'latitudeDeg', 'longitudeDeg', 'heightM']);
  if (!o) return null;
  const id = check.string(o.id, '/site/id');
  const label = check.string(o.label, '/site/label', true);
  const latitudeDeg = check.number(o.latitudeDeg, '/site/latitudeDeg', 'degrees', -90, 90);
  const longitudeDeg = check.number(o.longitudeDeg, '/site/longitudeDeg', 'degrees east', -180, 180);
  const heightM = check.number(o.heightM, '/site/heightM', 'm', -500, 9000);
  if (id === null || label === null || latitudeDeg === null || longitudeDeg === null || heightM === null) return null;
  return { id, label, latitudeDeg, longitudeDeg, heightM };
}

function checkEvents(check: JsonChecker, value: unknown, base: string): InstrumentEvent[] | null {
  const list = check.array(value ?? [], `${base}/events`);
  if (!list) return null;
  const events = list.map((item, k) => {
    const p = `${base}/events/${k}`;
    const o = check.object(item, p, ['date', 'kind', 'note']);
    if (!o) return null;
    const date = check.string(o.date, `${p}/date`);
    if (date !== null && !parseDateCell(date).ok) check.fail(`${p}/date`, `'${date}' is not a date YYYY-MM-DD`);
    const kind = check.choice(o.kind, `${p}/kind`, INSTRUMENT_EVENT_KINDS);
    const note = check.string(o.note ?? '', `${p}/note`, true);
    return date !== null && kind !== null && note !== null && parseDateCell(date).ok ? { date, kind, note } : null;
  });
  return events.every((e) => e !== null) ? (events as InstrumentEvent[]) : null;
}

function checkCamera(check: JsonChecker, value: unknown, p: string): InstrumentRecord['camera'] {
  const o = check.object(value, p, ['orientationDeg', 'parity', 'opticalCentrePx', 'referenceColumnPx']);
  if (!o) return null;
  const orientationDeg = check.number(o.orientationDeg, `${p}/orientationDeg`, 'degrees', -360, 360);
  const parity = check.choice(o.parity, `${p}/parity`, [1, -1] as const);
  const centre = check.array(o.opticalCentrePx, `${p}/opticalCentrePx`);
  const x = centre ? check.number(centre[0], `${p}/opticalCentrePx/0`, 'px', -1e5, 1e5) : null;
  const y = centre ? check.number(centre[1], `${p}/opticalCentrePx/1`, 'px', -1e5, 1e5) : null;
  if (centre && centre.length !== 2) check.fail(`${p}/opticalCentrePx`, `expected [x, y], got ${centre.length} numbers`);
  const referenceColumnPx = check.number(o.referenceColumnPx, `${p}/referenceColumnPx`, 'px', -1e5, 1e5);
  if (orientationDeg === null || parity === null || x === null || y === null || referenceColumnPx === null || centre?.length !== 2) return null;
  return { orientationDeg, parity, opticalCentrePx: [x, y], referenceColumnPx };
}

const INSTRUMENT_KEYS = ['id', 'label', 'kind', 'zenithScale', 'wireIntervalsS', 'effectiveWavelengthUm', 'clockId', 'clockTimeScale', 'camera', 'events'];

function checkInstrument(check: JsonChecker, value: unknown, k: number): InstrumentRecord | null {
  const p = `/instruments/${k}`;
  const o = check.object(value, p, INSTRUMENT_KEYS);
  if (!o) return null;
  const before = check.problems.length;
  const id = check.string(o.id, `${p}/id`);
  const label = check.string(o.label, `${p}/label`, true);
  const kind = check.choice(o.kind, `${p}/kind`, INSTRUMENT_KINDS);
  let zenithScale: InstrumentRecord['zenithScale'] = null;
  if (o.zenithScale !== undefined && o.zenithScale !== null) {
    const z = check.object(o.zenithScale, `${p}/zenithScale`, ['unit', 'arcsecPerUnit', 'sense']);
    const unit = z ? check.choice(z.unit, `${p}/zenithScale/unit`, ['turn', 'pixel'] as const) : null;
    const arcsecPerUnit = z ? check.number(z.arcsecPerUnit, `${p}/zenithScale/arcsecPerUnit`, 'arcsec per unit', 1e-6, 3600) : null;
    const sense = z ? check.choice(z.sense, `${p}/zenithScale/sense`, [1, -1] as const) : null;
    zenithScale = unit !== null && arcsecPerUnit !== null && sense !== null ? { unit, arcsecPerUnit, sense } : null;
  }
  const intervals = check.array(o.wireIntervalsS ?? [], `${p}/wireIntervalsS`) ?? [];
  const wireIntervalsS = intervals.map((v, i) => check.number(v, `${p}/wireIntervalsS/${i}`, 's of time', -3600, 3600));
  if (kind === 'transit' && intervals.length === 0) check.fail(`${p}/wireIntervalsS`, 'a transit instrument needs at least one wire interval ([0] for a single wire)');
  const effectiveWavelengthUm = check.number(o.effectiveWavelengthUm, `${p}/effectiveWavelengthUm`, 'µm', 0.3, 2.5);
  const clockId = check.string(o.clockId, `${p}/clockId`);
  const clockTimeScale = check.choice(o.clockTimeScale, `${p}/clockTimeScale`, ['sidereal', 'mean-solar'] as const);
  const camera = kind === 'fixed-camera' ? checkCamera(check, o.camera, `${p}/camera`) : null;
  const events = checkEvents(check, o.events, p);
  if (check.problems.length > before || id === null || label === null || kind === null || effectiveWavelengthUm === null) return null;
  if (clockId === null || clockTimeScale === null || events === null) return null;
  return { id, label, kind, zenithScale, wireIntervalsS: wireIntervalsS as number[], effectiveWavelengthUm, clockId, clockTimeScale, camera, events };
}

/**
 * Parses and validates a site/instrument description (UTF-8 JSON, layout in FORMATS.md). Every
 * problem is reported with a JSON pointer ('/instruments/0/kind') as its column; the document
 * is one row (row 1, line 0: the pointer locates the problem). Unknown keys are warned about.
 */
export function parseSiteDescription(bytes: Uint8Array, fileName: string): ParseResult<SiteDescription> {
  const decoded = decodeUtf8(bytes);
  if (!decoded.ok) return { rows: [], rejected: [{ row: 0, line: 0, column: '', reason: `${fileName}: ${decoded.reason}` }], warnings: [], totalRows: 0 };
  let value: unknown;
  try {
    value = JSON.parse(decoded.text);
  } catch (error) {
    return { rows: [], rejected: [{ row: 1, line: 0, column: '', reason: `not valid JSON: ${(error as Error).message}` }], warnings: [], totalRows: 1 };
  }
  const check = new JsonChecker();
  const root = check.object(value, '', ['formatVersion', 'site', 'instruments']);
  let result: SiteDescription | null = null;
  if (root) {
    const version = check.choice(root.formatVersion, '/formatVersion', [1] as const);
    const site = checkSite(check, root.site);
    const list = check.array(root.instruments, '/instruments') ?? [];
    const instruments = list.map((item, k) => checkInstrument(check, item, k));
    const ids = new Map<string, number>();
    instruments.forEach((inst, k) => {
      if (!inst) return;
      const first = ids.get(inst.id);
      if (first !== undefined) check.fail(`/instruments/${k}/id`, `instrument id '${inst.id}' is already used by /instruments/${first}`);
      else ids.set(inst.id, k);
    });
    if (check.problems.length === 0 && version !== null && site !== null) result = { formatVersion: version, site, instruments: instruments as InstrumentRecord[] };
  }
  const rejected: Rejection[] = check.problems.map((p) => ({ row: 1, line: 0, column: p.pointer, reason: p.reason }));
  return { rows: result ? [result] : [], rejected, warnings: check.warnings.map((w) => `${fileName}: ${w}`), totalRows: 1 };
}
