import { describe, expect, test } from 'vitest';
import { formatUtcMjd, parseEventForm } from '../../renderer/archive/parseEventForm.ts';

// MJD = JD − 2400000.5; 2000-01-01T12:00Z is JD 2451545.0 (J2000 epoch, IAU definition) = MJD 51544.5.
const NOW_MJD = 61_000; // 2026-02-24

describe('parseEventForm', () => {
  test('parseEventForm({2000-01-01, 12:00, relevelling}) gives MJD 51544.5 (J2000, IAU)', () => {
    const result = parseEventForm({ dateUtc: '2000-01-01', timeUtc: '12:00', kind: 'relevelling', note: ' bubble re-set ' }, NOW_MJD);
    expect(result).toEqual({ kind: 'valid', draft: { utcMjd: 51_544.5, kind: 'relevelling', note: 'bubble re-set' } });
  });

  test('an empty time means 00:00 UTC', () => {
    const result = parseEventForm({ dateUtc: '2000-01-01', timeUtc: '', kind: 'cleaning', note: '' }, NOW_MJD);
    expect(result.kind === 'valid' && result.draft.utcMjd).toBe(51_544);
  });

  test('refuses a non-date, a bad time, an unknown kind, the future and before 1900, naming each field', () => {
    expect(parseEventForm({ dateUtc: '2025-02-30', timeUtc: '', kind: 'cleaning', note: '' }, NOW_MJD))
      .toEqual({ kind: 'invalid', errors: { dateUtc: '2025-02-30 is not a calendar date' } });
    expect(parseEventForm({ dateUtc: '17/04/2025', timeUtc: '25:00', kind: 'polishing', note: '' }, NOW_MJD)).toEqual({
      kind: 'invalid',
      errors: {
        dateUtc: 'write the date as YYYY-MM-DD, e.g. 2025-04-17',
        timeUtc: 'write the time as HH:MM (UTC, 00:00–23:59) or leave it empty',
        kind: 'choose what was done from the list',
      },
    });
    expect(parseEventForm({ dateUtc: '2026-03-01', timeUtc: '', kind: 'other', note: '' }, NOW_MJD))
      .toEqual({ kind: 'invalid', errors: { dateUtc: 'the date is in the future: log an event after it was done' } });
    expect(parseEventForm({ dateUtc: '1899-12-31', timeUtc: '', kind: 'other', note: '' }, NOW_MJD))
      .toEqual({ kind: 'invalid', errors: { dateUtc: 'the date is before 1900: check the year' } });
  });

  test('formatUtcMjd(51544.5) is 2000-01-01 12:00:00', () => {
    expect(formatUtcMjd(51_544.5)).toBe('2000-01-01 12:00:00');
    expect(formatUtcMjd(51_544.5, false)).toBe('2000-01-01 12:00');
  });
});
