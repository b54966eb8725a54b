import { describe, expect, it } from 'vitest';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { parseIersFinals } from '../../core/time/earth-orientation-table.ts';
import { daysOfTable, SplicedEarthOrientation } from '../../core/time/spliced-earth-orientation.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { finals2016 } from './finals-excerpt.ts';
import { ARCSEC, MAS } from '../../core/units.ts';

// Four real lines of the IERS finals2000A file (2016-04-27 … 2016-04-30; finals-excerpt.ts): two 'I', two 'P'.
const FINALS_EXCERPT = finals2016(57505, 57508);

const bundled = bundledEarthOrientationTable();
const finals = parseIersFinals(FINALS_EXCERPT, 'finals2000A excerpt');
const bundledDays = daysOfTable(bundled);

// The same four days moved to MJD 61005–61008 (2026), after the bundled series ends: a structural
// check of a file that leaves a gap, values not meant as real ones.
const later = daysOfTable(finals).map((d) => ({ ...d, mjd: d.mjd + 3500 }));

describe('SplicedEarthOrientation: the bundled C04 series with an imported file', () => {
  it('an imported file overrides the bundled days it covers; the rest stays the bundled series (values printed in the files)', () => {
    const spliced = new SplicedEarthOrientation([bundledDays, daysOfTable(finals)], 'bundled C04 + finals2000A excerpt');
    expect(spliced.spans.map((s) => [s.firstMjd, s.lastMjd])).toEqual([[bundled.firstMjd, bundled.lastMjd]]);
    for (const mjd of [37665.25, 50000.5, 57500, bundled.lastMjd - 0.3]) {
      const a = spliced.at(mjd);
      const b = bundled.at(mjd);
      // Equal up to the arcsec ↔ radian round trip of the day values (1e-16 relative).
      expect(Math.abs(a.dut1Seconds - b.dut1Seconds)).toBeLessThan(1e-14);
      expect(Math.abs(a.xpRad - b.xpRad) + Math.abs(a.ypRad - b.ypRad)).toBeLessThan(1e-9 * MAS);
      expect(a.status).toBe(b.status);
    }
    // File line "16 428 57506.00 I  0.029730 ... 0.468564 ... I-0.1303716": the node's own values, not C04's.
    const node = spliced.at(57506);
    expect(node.dut1Seconds).toBeCloseTo(-0.1303716, 12);
    expect(node.xpRad / ARCSEC).toBeCloseTo(0.02973, 12);
    expect(node.ypRad / ARCSEC).toBeCloseTo(0.468564, 12);
    expect(bundled.at(57506).xpRad / ARCSEC).not.toBeCloseTo(0.02973, 6);
  });

  it('an instant in the gap between spans gets zeros and a note naming the gap, not an extrapolation', () => {
    const spliced = new SplicedEarthOrientation([bundledDays, later], 'tables');
    expect(spliced.spans.map((s) => [s.firstMjd, s.lastMjd])).toEqual([[bundled.firstMjd, bundled.lastMjd], [61005, 61008]]);
    expect(spliced.at(61006).dut1Seconds).toBeCloseTo(-0.1303716, 12);
    expect(spliced.at(61007.5).status).toBe('predicted');
    const gap = spliced.at(60500.5);
    expect([gap.dut1Seconds, gap.xpRad, gap.ypRad, gap.status]).toEqual([0, 0, 0, 'outside-table']);
    expect(gap.note).toContain(`gap of the tables (MJD ${bundled.lastMjd} to 61005)`);
    expect(spliced.at(62000).note).toContain('after the last tabulated day (MJD 61008)');
    expect(spliced.at(30000).note).toContain(`before the first tabulated day (MJD ${bundled.firstMjd})`);
  });

  it('a later layer overrides an earlier one day by day; a lone day makes no span; fractional days are refused', () => {
    const shifted = daysOfTable(finals).map((d) => ({ ...d, dut1Seconds: d.dut1Seconds + 0.001 }));
    const lone = { mjd: 57600, dut1Seconds: 0.1, xArcsec: 0, yArcsec: 0, predicted: false };
    const spliced = new SplicedEarthOrientation([daysOfTable(finals), shifted.slice(1, 3), [lone]], 't');
    expect(spliced.at(57505).dut1Seconds).toBeCloseTo(-0.1290372, 12);
    expect(spliced.at(57506).dut1Seconds).toBeCloseTo(-0.1293716, 12);
    expect(spliced.spans).toHaveLength(1);
    expect(spliced.at(57600).status).toBe('outside-table');
    expect(() => new SplicedEarthOrientation([[{ ...lone, mjd: 57505.5 }]], 'bad')).toThrow(/57505\.5 is not a whole day/);
  });

  it('TimeScale takes it and carries its note as a warning', () => {
    const scale = new TimeScale(BUNDLED_LEAP_SECONDS, new SplicedEarthOrientation([bundledDays, later], 'tables'));
    const inside = scale.fromUtc({ jd1: 2_400_000.5, jd2: 57000 });
    expect(inside.dut1Seconds).toBeCloseTo(bundled.at(57000).dut1Seconds, 13);
    expect(inside.warnings).toEqual([]);
    const gap = scale.fromUtc({ jd1: 2_400_000.5, jd2: 60500 });
    expect(gap.dut1Seconds).toBe(0);
    expect(gap.warnings.join(' ')).toMatch(/gap of the tables/);
  });
});
