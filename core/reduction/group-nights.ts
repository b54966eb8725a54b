import type { Rejection } from '../formats/parse-result.ts';
import type { TransitLogRow } from '../formats/transit-log.ts';
import { utcCountS } from '../formats/utc-instant.ts';

/** The transit rows of one night and instrument. */
export interface LogNight {
  readonly nightDateMjd: number;
  readonly instrumentId: string;
  readonly rows: readonly TransitLogRow[];
}

/**
 * Splits a transit log into nights (per instrument). A row's night is its `nightDate`; without
 * one, a UTC row belongs to the local date on which its evening began: floor(MJD_UTC + λ/360° −
 * ½), λ east positive (local mean time minus 12 h). A clock row without `nightDate` is rejected:
 * its clock day cannot be known. Rows without `instrumentId` belong to `defaultInstrumentId`.
 */
export function groupNights(rows: readonly TransitLogRow[], longitudeDeg: number, defaultInstrumentId: string): { nights: LogNight[]; rejected: Rejection[] } {
  const byKey = new Map<string, { nightDateMjd: number; instrumentId: string; rows: TransitLogRow[] }>();
  const rejected: Rejection[] = [];
  for (const row of rows) {
    let night = row.nightDateMjd;
    if (night === null) {
      if (row.times.kind === 'clock') {
        rejected.push({ row: row.row, line: row.line, column: 'nightDate', reason: 'a clock-time row needs its nightDate (the clock counts from 0 h of that date)' });
        continue;
      }
      night = Math.floor(utcCountS(row.times.wires[0].utc) / 86_400 + longitudeDeg / 360 - 0.5);
    }
    const instrumentId = row.instrumentId ?? defaultInstrumentId;
    const key = `${night}\u0000${instrumentId}`;
    const entry = byKey.get(key) ?? { nightDateMjd: night, instrumentId, rows: [] };
    entry.rows.push(row);
    byKey.set(key, entry);
  }
  const nights = [...byKey.values()].sort((a, b) => a.nightDateMjd - b.nightDateMjd || a.instrumentId.localeCompare(b.instrumentId));
  return { nights, rejected };
}
