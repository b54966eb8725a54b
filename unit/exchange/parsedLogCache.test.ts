import { describe, expect, test } from 'vitest';
import { forgetParsedLog, parseTransitLogOnce } from '../../renderer/exchange/parsedLogCache.ts';

const encoder = new TextEncoder();
const LOG = 'starId,culmination,wire1Utc\nQX-1,upper,2026-01-01T21:07:10Z\nQX-9,upper,2026-01-01T22:07:10Z\n';

describe('parseTransitLogOnce', () => {
  test('parseTransitLogOnce(bytes, name, stars) reuses the parse only for the same bytes, name and star ids', () => {
    forgetParsedLog();
    const stars = new Set(['QX-1']);
    const first = parseTransitLogOnce(encoder.encode(LOG), 'log.csv', stars);
    expect(first.rows.map((r) => r.starId)).toEqual(['QX-1']);
    expect(first.rejected.map((r) => r.reason)).toEqual(["unknown star id 'QX-9'; add it to the star list or correct the id"]);
    expect(parseTransitLogOnce(encoder.encode(LOG), 'log.csv', new Set(['QX-1']))).toBe(first); // a fresh copy of the same bytes
    const moreStars = parseTransitLogOnce(encoder.encode(LOG), 'log.csv', new Set(['QX-1', 'QX-9']));
    expect(moreStars.rows.map((r) => r.starId)).toEqual(['QX-1', 'QX-9']);
    const changed = parseTransitLogOnce(encoder.encode(LOG.replace('21:07:10', '21:07:11')), 'log.csv', new Set(['QX-1', 'QX-9']));
    expect(changed).not.toBe(moreStars);
    expect(changed.rows[0].times).toMatchObject({ kind: 'utc', wires: [{ utc: { secondsOfDay: 21 * 3600 + 7 * 60 + 11 } }] });
    expect(parseTransitLogOnce(encoder.encode(LOG.replace('21:07:10', '21:07:11')), 'other.csv', new Set(['QX-1', 'QX-9']))).not.toBe(changed);
    forgetParsedLog();
  });
});
