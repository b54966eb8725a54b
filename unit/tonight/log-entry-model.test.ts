import { describe, expect, it } from 'vitest';
import type { InstrumentRecord, StarRecord } from '../../core/archive/records.ts';
import { DEG, SECONDS_PER_DAY } from '../../core/units.ts';
import { judgeEntry, rowForStar, transitDraftOf, type EntryContext } from '../../renderer/tonight/logEntryModel.ts';
import { formatTimeOfDay } from '../../renderer/tonight/nightWindow.ts';
import { expectedWireClockMjd } from '../../renderer/tonight/observedMinusComputed.ts';
import type { ProgrammeRow } from '../../renderer/tonight/programmeRows.ts';

// Invented instrument and stars; expected values follow from core reduceToMeanWire (through
// checkEntry, tested in observed-minus-computed.test.ts) and the record conventions of records.ts.
const INSTRUMENT = {
  id: 'i1', label: 'Test transit', kind: 'transit', siteId: 's1', readingUnit: 'micrometer-turn', readingScaleArcsecPerUnit: 30,
  readingSense: 1, wireIntervalsEquatorialS: [20, 0, -20], effectiveWavelengthNm: 550, clockLabel: 'pier clock', note: '',
  visibility: 'visible', createdUtc: '', updatedUtc: '',
} satisfies InstrumentRecord;

function row(catalogueId: string, utcMjd: number): ProgrammeRow {
  return {
    key: `${catalogueId}|${utcMjd}`, star: { id: catalogueId.toLowerCase(), catalogueId, label: catalogueId } as StarRecord,
    clockMjd: utcMjd + 2 / SECONDS_PER_DAY, zenithDistanceDeg: 10, readingSetting: 1200, daylight: false,
    transit: {
      starId: catalogueId.toLowerCase(), culmination: 'upper', utcMjd, side: 'south', geometricZenithRad: 10 * DEG, observedZenithRad: 10 * DEG,
      declinationRad: 37 * DEG, sunAltitudeRad: -0.4, starSunSeparationRad: 2, caution: null, warnings: [],
    },
  };
}

const ROWS = [row('ML-01', 60_000.8), row('ML-02', 60_000.85), row('ML-01', 60_001.79)];
const CONTEXT: EntryContext = {
  rows: ROWS, nextIndex: 1, loggedKeys: new Set(), nowUtcMjd: 60_000.82, instrument: INSTRUMENT, zeroPointDeg: 0, clamp: 'west',
  tolerances: { timeS: 0.3, zenithArcsec: 2 },
};

describe('rowForStar(id, context)', () => {
  it('an empty id means the next star; an id means that star\'s open transit nearest now', () => {
    expect(rowForStar('', CONTEXT)).toEqual({ ok: true, value: ROWS[1] });
    expect(rowForStar('ML-01', CONTEXT)).toEqual({ ok: true, value: ROWS[0] });
    expect(rowForStar('ML-01', { ...CONTEXT, loggedKeys: new Set([ROWS[0].key]) })).toEqual({ ok: true, value: ROWS[2] });
  });
  it('refuses an unknown star and an empty id when nothing is left', () => {
    expect(rowForStar('ML-77', CONTEXT)).toMatchObject({ ok: false, reason: expect.stringMatching(/"ML-77" is not in tonight's programme/) });
    expect(rowForStar('', { ...CONTEXT, nextIndex: -1 })).toMatchObject({ ok: false, reason: expect.stringMatching(/no transit left/) });
  });
});

describe('judgeEntry and transitDraftOf', () => {
  const target = ROWS[1];
  const expected = expectedWireClockMjd(target, target.clockMjd!, INSTRUMENT, 'west');
  const typed = expected.map(formatTimeOfDay);

  it('judges the typed fields and stores the mean-wire clock time, the wires and UTC = clock − offset', () => {
    const judged = judgeEntry({ starCatalogueId: '', wiresText: typed.join(' '), readingText: '1200' }, CONTEXT);
    expect(judged.check).not.toBeNull();
    expect(Math.abs(judged.check!.timeOmcS)).toBeLessThan(0.05); // typed to 0.1 s
    expect(judged.check!.zenithOmcArcsec).toBeCloseTo(0, 6); // 1200 turns × 30″ = 10° = predicted z
    const wires = judged.wires!.ok ? judged.wires!.value : null;
    const draft = transitDraftOf(target, wires!, 1200, judged.check!, 2, 'west');
    expect(draft.clamp).toBe('west');
    expect(draft.wireClockMjd).toHaveLength(3);
    expect((draft.clockMjd - draft.utcMjd) * SECONDS_PER_DAY).toBeCloseTo(2, 6);
    expect(draft.zenithReadings).toEqual([1200]);
    expect(draft.note).toBe('');
  });

  it('a missed wire keeps only the mean (the stored wire list must match the instrument\'s order) and says so in the note', () => {
    const judged = judgeEntry({ starCatalogueId: 'ML-02', wiresText: `${typed[0]} - ${typed[2]}`, readingText: '' }, CONTEXT);
    const wires = judged.wires!.ok ? judged.wires!.value : null;
    const draft = transitDraftOf(target, wires!, null, judged.check!, null, 'none');
    expect('clamp' in draft).toBe(false); // an instrument that is not reversed stores no clamp
    expect(draft.wireClockMjd).toEqual([]);
    expect(draft.zenithReadings).toEqual([]);
    expect(draft.note).toMatch(/wires missed: 2/);
    expect(draft.note).toMatch(/clock taken as UTC/);
    expect(draft.utcMjd).toBe(draft.clockMjd);
  });

  it('gives no O−C while a field is refused', () => {
    const judged = judgeEntry({ starCatalogueId: 'ML-02', wiresText: typed.join(' '), readingText: 'abc' }, CONTEXT);
    expect(judged.reading.ok).toBe(false);
    expect(judged.check).toBeNull();
  });
});
