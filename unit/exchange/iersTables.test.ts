import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, test } from 'vitest';
import { calendarDayToMjd } from '../../core/time/julian-date.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { importEarthOrientation, importLeapSecondsList, tableFreshness } from '../../renderer/exchange/iersTables.ts';
import { finals2016 } from '../time/finals-excerpt.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';

// The IERS leap-seconds.list as shipped in assets/ (Debian tzdata 2026f, hash-checked by the parser).
const leapList = readFileSync(fileURLToPath(new URL('../../assets/leap-seconds.list', import.meta.url)), 'utf8');

// Four real lines of the IERS finals2000A file (2016-04-27 … 2016-04-30; unit/time/finals-excerpt.ts).
const FINALS = finals2016(57505, 57508);

const NOW = '2026-03-20T12:00:00.000Z';

describe('IERS tables in the archive', () => {
  test('a leap-seconds.list lands as its 28 steps, 10 s in 1972 to 37 s from 2017-01-01 (IERS Bulletin C)', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('iers-leap'));
    const info = await importLeapSecondsList(database, leapList, 'leap-seconds.list', NOW);
    const steps = await database.leapSeconds.orderBy('mjd').toArray();
    expect(steps.length).toBe(28);
    expect(steps[0]).toMatchObject({ mjd: calendarDayToMjd(1972, 1, 1), taiMinusUtcS: 10 });
    expect(steps.at(-1)).toMatchObject({ mjd: calendarDayToMjd(2017, 1, 1), taiMinusUtcS: 37 });
    expect(info.expiresMjd).toBe(calendarDayToMjd(2027, 6, 28)); // '#@' line of the file
    const fresh = await tableFreshness(database, calendarDayToMjd(2026, 3, 20));
    expect(fresh.leapSeconds.origin).toBe('imported');
    expect((await tableFreshness(database, calendarDayToMjd(2027, 7, 1))).warnings.join(' ')).toMatch(/leap-second list expired 3 days ago/);
    database.close();
  });

  test('a finals2000A file lands day by day with the printed values and I/P kinds', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('iers-finals'));
    const info = await importEarthOrientation(database, FINALS, 'finals2000A.daily', NOW);
    expect(info).toMatchObject({ firstMjd: 57505, lastMjd: 57508, lastObservedMjd: 57506 });
    const days = await database.earthOrientation.orderBy('mjd').toArray();
    expect(days.map((d) => d.kind)).toEqual(['final', 'final', 'predicted', 'predicted']);
    // Printed values of the file; 1e-12 is far below the 1e-7 s / 1e-6 ″ the file prints.
    expect(days[1].dut1S).toBeCloseTo(-0.1303716, 12);
    expect(days[1].xpArcsec).toBeCloseTo(0.029730, 12);
    expect(days[1].ypArcsec).toBeCloseTo(0.468564, 12);
    const fresh = await tableFreshness(database, calendarDayToMjd(2026, 3, 20));
    expect(fresh.earthOrientation).toMatchObject({ origin: 'imported', lastObservedMjd: 57506 });
    expect(fresh.warnings.join(' ')).toMatch(/Observed Earth orientation ends \d+ days ago/);
    database.close();
  });

  test('without imports the bundled tables are reported, and the bundled C04 (to 2022-11-29) is stale in 2026', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('iers-bundled'));
    const fresh = await tableFreshness(database, calendarDayToMjd(2026, 3, 20));
    expect(fresh.leapSeconds.origin).toBe('bundled');
    expect(fresh.earthOrientation).toMatchObject({ origin: 'bundled', lastMjd: calendarDayToMjd(2022, 11, 29) });
    expect(fresh.warnings).toHaveLength(1);
    database.close();
  });

  test('a file that is neither layout is refused with the reason and nothing is written', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('iers-bad'));
    await expect(importEarthOrientation(database, 'hello\nworld\n', 'notes.txt', NOW)).rejects.toThrow(/notes.txt: fewer than two daily lines/);
    expect(await database.earthOrientation.count()).toBe(0);
    database.close();
  });
});
