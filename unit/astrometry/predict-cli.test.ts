import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { formatIsoUtc } from '../../core/time/iso.ts';
import { ARCSEC, DEG, MAS, SECONDS_PER_DAY } from '../../core/units.ts';
import { loadErfaPlaceFixture } from './erfa-place-fixture.ts';

const fixture = loadErfaPlaceFixture();
const source = `ERFA ${fixture.header.erfaVersion} (${fixture.header.generator})`;
const bin = new URL('../../main/cli/bin.mjs', import.meta.url).pathname;

function runPredict(input: string) {
  const result = spawnSync(process.execPath, [bin, 'predict'], { input, encoding: 'utf8', env: { ...process.env, TZ: 'UTC' } });
  return { status: result.status, lines: result.stdout.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>), stderr: result.stderr };
}

describe('meridian-ledger predict (spawned)', () => {
  const cases = fixture.transits;
  const input = cases.map((c) => JSON.stringify({
    star: c.star, site: c.site, culmination: c.culmination, weather: c.weather ?? undefined, eop: c.eop,
    afterUtc: formatIsoUtc({ jd1: c.afterUtc[0], jd2: c.afterUtc[1] }, BUNDLED_LEAP_SECONDS, 6),
  })).join('\n');
  // afterUtc is written to the µs, so the star may be searched from up to 0.5 µs away: irrelevant.
  const { status, lines, stderr } = runPredict(`${input}\n`);

  it(`answers every line with the culmination of erfa.atco13 within 3 mas of hour angle (${source})`, () => {
    expect(stderr).toBe('');
    expect(status).toBe(0);
    expect(lines).toHaveLength(cases.length);
    cases.forEach((c, k) => {
      const out = lines[k];
      const mjdErfa = c.transit.utc[0] - 2400000.5 + c.transit.utc[1];
      const dtSeconds = ((out.transitMjdUtc as number) - mjdErfa) * SECONDS_PER_DAY;
      expect(Math.abs(dtSeconds) * 15 * ARCSEC * Math.cos(c.declinationRad) / MAS, `line ${k + 1}`).toBeLessThan(3);
      expect(Math.abs((out.zenithDistanceDeg as number) * DEG - c.observedZenithRad) / MAS, `line ${k + 1} zenith`).toBeLessThan(3);
      expect(out.transitUtc).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{6}Z$/);
      expect(out.side === 'north' || out.side === 'south').toBe(true);
      const dRa = ((out.apparentRaDeg as number) * DEG - c.apparent.raRad);
      expect(Math.abs(Math.atan2(Math.sin(dRa), Math.cos(dRa))) * Math.cos(c.apparent.decRad) / MAS).toBeLessThan(3);
      expect(Math.abs((out.apparentDecDeg as number) * DEG - c.apparent.decRad) / MAS).toBeLessThan(3);
    });
  });

  it('adds the safety caution to a daylight transit near the Sun (Sun at RA 90°, Dec +23.4° at the June solstice)', () => {
    const request = { star: { raDeg: 90, decDeg: 28, epochJyear: 2000 }, site: { latDeg: 46.2, lonDeg: 7.4, heightM: 820 }, afterUtc: '2025-06-21T00:00:00Z' };
    const result = runPredict(`${JSON.stringify(request)}\n`);
    expect(result.status).toBe(0);
    const out = result.lines[0];
    expect(out.sunAltitudeDeg as number).toBeGreaterThan(60);
    expect(out.sunDistanceDeg as number).toBeLessThan(6);
    expect(out.caution).toMatch(/daylight .* unfiltered instrument .* safety rules/);
  });

  it('reports a bad line with its number and the field, processes the rest, skips blank lines, exits 1', () => {
    const good = input.split('\n')[0];
    const result = runPredict([good, '', '{"star":{"raDeg":10,"decDeg":95},"site":{"latDeg":1,"lonDeg":2},"afterUtc":"2025-01-01T00:00:00Z"}', 'nope', '{"star":{"raDeg":1,"decDeg":1},"site":{"latDeg":1,"lonDeg":2},"afterUtc":"2025-01-01T00:00:00Z","culmination":"middle"}', good].join('\n'));
    expect(result.status).toBe(1);
    expect(result.lines).toHaveLength(5);
    expect(result.lines[0].transitUtc).toBeDefined();
    expect(result.lines[1]).toEqual({ error: expect.stringMatching(/star\.decDeg must lie within ±90° \(got 95\)/), line: 3 });
    expect(result.lines[2]).toEqual({ error: expect.stringMatching(/not valid JSON/), line: 4 });
    expect(result.lines[3]).toEqual({ error: expect.stringMatching(/culmination must be "upper" or "lower"/), line: 5 });
    expect(result.lines[4].transitUtc).toBe(result.lines[0].transitUtc);
  });

  it('refuses a right ascension outside [0, 360) degrees rather than wrapping it', () => {
    const result = runPredict('{"star":{"raDeg":400,"decDeg":5},"site":{"latDeg":1,"lonDeg":2},"afterUtc":"2025-01-01T00:00:00Z"}\n');
    expect(result.status).toBe(1);
    expect(result.lines[0]).toEqual({ error: expect.stringMatching(/star\.raDeg must lie in \[0, 360\) degrees \(got 400\)/), line: 1 });
  });
});
