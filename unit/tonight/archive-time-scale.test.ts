import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { calendarDayToMjd } from '../../core/time/julian-date.ts';
import { ARCSEC } from '../../core/units.ts';
import { importEarthOrientation, importLeapSecondsList } from '../../renderer/exchange/iersTables.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { archiveTimeScale } from '../../renderer/worker/tasks/archiveTimeScale.ts';
import { runTonightProgramme } from '../../renderer/worker/tasks/tonightProgramme.ts';
import { finalsMoved } from '../time/finals-excerpt.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';

// The IERS leap-seconds.list as shipped in assets/ (Debian tzdata 2026f, hash-checked by the parser).
const leapList = readFileSync(fileURLToPath(new URL('../../assets/leap-seconds.list', import.meta.url)), 'utf8');
// Real finals2000A lines (2016-04-27 … 2016-04-30, unit/time/finals-excerpt.ts) moved on by 3,500
// days (to 2025-11) so they lie after the bundled C04 series: a structural check of a gap, not real values for those dates.
const FINALS_MOVED = finalsMoved(3500, 57505, 57508);
const NOW = '2026-01-26T12:00:00.000Z';

describe('the reductions in the worker use the archive’s imported IERS tables over the bundled ones', () => {
  it('an empty archive: the bundled leap seconds and C04 series', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('time-scale-empty'));
    const { scale, tablesInUse } = await archiveTimeScale(database);
    expect(tablesInUse).toMatch(/leap seconds: .*\(bundled\); Earth orientation: .*\(bundled\)$/);
    const bundled = bundledEarthOrientationTable().at(59000);
    expect(scale.fromUtc({ jd1: 2_400_000.5, jd2: 59000 }).dut1Seconds).toBeCloseTo(bundled.dut1Seconds, 12);
    database.close();
  });

  it('imported days are used, a gap is warned about, and the imported leap list is the one in force', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('time-scale-imported'));
    await importLeapSecondsList(database, leapList, 'leap-seconds.list', NOW);
    await importEarthOrientation(database, FINALS_MOVED, 'finals2000A.daily', NOW);
    const { scale, tablesInUse } = await archiveTimeScale(database);
    expect(tablesInUse).toContain('leap-seconds.list (imported)');
    expect(tablesInUse).toContain('finals2000A.daily (imported)');
    expect(scale.leapSeconds.expiresMjd).toBe(calendarDayToMjd(2027, 6, 28)); // the list's '#@' line
    const day = scale.fromUtc({ jd1: 2_400_000.5, jd2: 61006 });
    expect(day.dut1Seconds).toBeCloseTo(-0.1303716, 12); // the file's printed UT1 − UTC
    expect(day.xpRad / ARCSEC).toBeCloseTo(0.02973, 12);
    expect(scale.fromUtc({ jd1: 2_400_000.5, jd2: 60500 }).warnings.join(' ')).toMatch(/gap of the tables \(MJD 59912 to 61005\)/);
    database.close();
  });

  it('the Tonight programme of a night in the gap carries the warning and names the tables', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('time-scale-tonight'));
    await importEarthOrientation(database, FINALS_MOVED, 'finals2000A.daily', NOW);
    const control = UNCONTROLLED;
    const request = {
      kind: 'tonight-programme' as const, site: { latitudeDeg: 47, longitudeDeg: 8, heightM: 500 },
      stars: [{ id: 'S1', raDeg: 30, decDeg: 40, pmRaMasYr: 0, pmDecMasYr: 0, parallaxMas: 0, radialVelocityKmS: 0, catalogueEpochJulianYear: 2016 }],
      fromUtcMjd: 60500.7, untilUtcMjd: 60501.3, weather: null, databaseName: database.name,
    };
    const result = await runTonightProgramme(request, control);
    expect(result.transits.length).toBeGreaterThan(0);
    expect(result.tablesInUse).toContain('finals2000A.daily (imported)');
    // Said once for the night, not once per predicted instant.
    expect(result.notes.filter((n) => /gap of the tables/.test(n))).toEqual([expect.stringMatching(/^This night: it falls in a gap of the tables/)]);
    const inside = await runTonightProgramme({ ...request, fromUtcMjd: 61005.7, untilUtcMjd: 61006.3 }, control);
    expect(inside.notes.join(' ')).not.toMatch(/gap of the tables|outside/);
    database.close();
  });
});
