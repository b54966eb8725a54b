import { describe, expect, it } from 'vitest';
import { parseStarList } from '../../core/formats/star-list.ts';
import { parseSiteDescription } from '../../core/formats/site-description.ts';

const bytes = (text: string): Uint8Array => new TextEncoder().encode(text);

describe('parseStarList', () => {
  const header = 'id,label,raDeg,decDeg,epochJyear,pmRaCosDecMasYr,pmDecMasYr,parallaxMas,parallaxSigmaMas,radialVelocityKmS,magnitude,source,programme';
  it('reads a star with every field; check values: Barnard\'s star, Gaia DR3 (Gaia Collaboration 2023), from memory', () => {
    // Gaia DR3 4472832130942575872 at epoch 2016.0: α 269.4486°, δ +4.7397°, μα* −801.55, μδ 10362.39 mas/yr,
    // ϖ 546.98 ± 0.04 mas, rv −110.5 km/s, G = 8.19 — quoted from memory as check values, rounded.
    const text = `${header}\nB-1,Barnard's star,269.4486,4.7397,2016.0,-801.55,10362.39,546.98,0.04,-110.5,8.19,Gaia DR3 (from memory),clock-stars;high-pm\n`;
    const r = parseStarList(bytes(text), 'stars.csv');
    expect(r.rejected).toEqual([]);
    expect(r.rows[0]).toMatchObject({ id: 'B-1', raDeg: 269.4486, pmDecMasYr: 10362.39, programmes: ['clock-stars', 'high-pm'] });
  });
  it('rejects impossible values and duplicate ids; absent columns are unknown, not zero', () => {
    const text = 'id,raDeg,decDeg,epochJyear,magnitude\nS-1,10,95,2000,5\nS-2,360,0,2000,5\nS-3,10,10,2000,\nS-3,11,10,2000,4\n';
    const r = parseStarList(bytes(text), 's.csv');
    expect(r.rows.map((s) => s.id)).toEqual(['S-3']);
    expect(r.rows[0].parallaxMas).toBeNull();
    expect(r.rows[0].magnitude).toBeNull();
    expect(r.rejected.map((x) => [x.row, x.column])).toEqual([[1, 'decDeg'], [2, 'raDeg'], [4, 'id']]);
    expect(r.warnings.join(' ')).toMatch(/absent: those values are unknown \(null\), not zero/);
  });
});

describe('parseStarList: the stated position and proper-motion σ (catalogue priors)', () => {
  it('reads them, leaves an empty cell unknown, refuses 0 and a negative σ, and does not warn when the columns are absent', () => {
    const text = 'id,raDeg,decDeg,epochJyear,positionSigmaMas,pmSigmaMasYr\nS-1,10,10,2016,0.05,0.07\nS-2,11,10,2016,,0.07\nS-3,12,10,2016,0,0.07\nS-4,13,10,2016,1,-2\n';
    const r = parseStarList(bytes(text), 's.csv');
    expect(r.rows.map((s) => [s.id, s.positionSigmaMas, s.pmSigmaMasYr])).toEqual([['S-1', 0.05, 0.07], ['S-2', null, 0.07]]);
    expect(r.rejected.map((x) => [x.row, x.column])).toEqual([[3, 'positionSigmaMas'], [4, 'pmSigmaMasYr']]);
    expect(r.rejected[0].reason).toMatch(/standard error of 0 is impossible/);
    const without = parseStarList(bytes('id,raDeg,decDeg,epochJyear\nS-1,10,10,2016\n'), 's.csv');
    expect(without.warnings.join(' ')).not.toMatch(/positionSigmaMas|pmSigmaMasYr/);
    expect(without.rows[0].positionSigmaMas).toBeNull();
  });
});

describe('parseSiteDescription', () => {
  const good = {
    formatVersion: 1,
    site: { id: 'hollow-ridge', label: 'Hollow Ridge (invented)', latitudeDeg: 47.3, longitudeDeg: 8.52, heightM: 610 },
    instruments: [
      {
        id: 'mt-1', label: 'Meridian transit (invented)', kind: 'transit', zenithScale: { unit: 'turn', arcsecPerUnit: 51.3, sense: 1 },
        wireIntervalsS: [20.1, 10.05, 0, -10.02, -20.08], effectiveWavelengthUm: 0.55, clockId: 'clock-a', clockTimeScale: 'sidereal',
        events: [{ date: '2025-11-02', kind: 'relevelling', note: 'after the frost' }],
      },
    ],
  };
  it('accepts a valid description and warns about unknown keys with their path', () => {
    const r = parseSiteDescription(bytes(JSON.stringify({ ...good, colour: 'blue' })), 'site.json');
    expect(r.rejected).toEqual([]);
    expect(r.rows[0].instruments[0].wireIntervalsS).toHaveLength(5);
    expect(r.warnings.join(' ')).toMatch(/\/: unknown key\(s\) ignored: colour/);
  });
  it('names every bad field by its JSON pointer', () => {
    const bad = structuredClone(good);
    bad.site.latitudeDeg = 91;
    bad.instruments[0].kind = 'meridian';
    bad.instruments[0].events[0].date = '2025-13-02';
    bad.instruments.push({ ...good.instruments[0], kind: 'fixed-camera' });
    const r = parseSiteDescription(bytes(JSON.stringify(bad)), 'site.json');
    expect(r.rows).toEqual([]);
    expect(r.rejected.map((x) => x.column)).toEqual(['/site/latitudeDeg', '/instruments/0/kind', '/instruments/0/events/0/date', '/instruments/1/camera']);
  });
  it('reports invalid JSON and invalid UTF-8', () => {
    expect(parseSiteDescription(bytes('{"site": '), 'a.json').rejected[0].reason).toMatch(/not valid JSON/);
    expect(parseSiteDescription(new Uint8Array([0x7b, 0xff]), 'a.json').rejected[0].reason).toMatch(/byte offset 1/);
  });
});
