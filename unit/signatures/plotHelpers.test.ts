import { describe, expect, it } from 'vitest';
import { trueLongitude } from 'astronomia/solar';
import { dayOfYearFromMjd, mjdFromTtDays, paddedExtent, symmetricExtent } from '../../renderer/signatures/plotScales.ts';
import { fitAnnual, parallaxEllipsePoints, YEAR_DAYS } from '../../renderer/signatures/parallaxEllipse.ts';
import { correlationColour, parseColour } from '../../renderer/signatures/heatColour.ts';
import { hashForNight, nightIdFromHash } from '../../renderer/signatures/nightLink.ts';
import { viewFromHash } from '../../renderer/navigation/views.ts';

describe('plot scales', () => {
  it('paddedExtent([0, 10]) widens by 5 % each side and ignores NaN', () => {
    expect(paddedExtent([0, Number.NaN, 10])).toEqual([-0.5, 10.5]);
  });
  it('paddedExtent of one value gives a span of minimumSpan around it', () => {
    expect(paddedExtent([3], 0.05, 2)).toEqual([2, 4]);
  });
  it('symmetricExtent([-1, 4]) is centred on zero', () => {
    expect(symmetricExtent([-1, 4], 0)).toEqual([-4, 4]);
  });
  it('paddedExtent refuses a negative padding', () => {
    expect(() => paddedExtent([1, 2], -1)).toThrow(/paddingFraction must be ≥ 0/);
  });
  it('mjdFromTtDays(0) is MJD 51544.5 (J2000.0 = JD 2451545.0; MJD = JD − 2400000.5, IAU definition)', () => {
    expect(mjdFromTtDays(0)).toBe(51544.5);
  });
  it('dayOfYearFromMjd: 2000-01-01 0h UTC is MJD 51544 (published MJD definition) → day 1; 2024-03-01 is day 61 of a leap year', () => {
    expect(dayOfYearFromMjd(51544)).toBeCloseTo(1, 12);
    // 2024-03-01 = MJD 60370 (from memory, checked: 60310 = 2024-01-01 plus 31 + 29 days).
    expect(dayOfYearFromMjd(60370.5)).toBeCloseTo(61.5, 9);
  });
});

describe('parallax ellipse', () => {
  it('fitAnnual recovers an exact annual sinusoid', () => {
    const t = Array.from({ length: 40 }, (_, i) => 7000 + i * 23.7);
    const y = t.map((d) => 0.2 + 0.7 * Math.cos((2 * Math.PI * d) / YEAR_DAYS) - 0.4 * Math.sin((2 * Math.PI * d) / YEAR_DAYS));
    const fit = fitAnnual(t, y);
    expect(fit.constant).toBeCloseTo(0.2, 10);
    expect(fit.cosine).toBeCloseTo(0.7, 10);
    expect(fit.sine).toBeCloseTo(-0.4, 10);
  });

  it('fitAnnual refuses instants that cover too little of the year', () => {
    expect(() => fitAnnual([1, 1, 1, 1], [0, 1, 2, 3])).toThrow(/too little of the year/);
    expect(() => fitAnnual([1, 2], [0, 1])).toThrow(/at least 3/);
  });

  it('the ellipse of a star at ecliptic latitude 30° has semi-axes 1 and sin 30° (Smart, Spherical Astronomy, the parallactic ellipse; from memory)', () => {
    // Factors on the ecliptic frame for a circular orbit: Δλ cos β = ϖ sin(λ☉ − λ), Δβ = −ϖ sin β cos(λ☉ − λ),
    // with the Sun's true longitude from astronomia (Meeus ch. 25) at irregular nights of 1.6 years
    // (T in Julian centuries of TT from J2000.0, Meeus eq. 22.1).
    const beta = Math.PI / 6, lambda = 1.1;
    const t = Array.from({ length: 90 }, (_, i) => 8000 + i * 6.5 + 2 * Math.sin(i));
    const sunLon = t.map((d) => trueLongitude(d / 36525).lon);
    const factors = {
      ttDaysSinceJ2000: t,
      raFactor: sunLon.map((l) => Math.sin(l - lambda)),
      decFactor: sunLon.map((l) => -Math.sin(beta) * Math.cos(l - lambda)),
    };
    const points = parallaxEllipsePoints(factors, 360);
    const semiX = Math.max(...points.map((p) => Math.abs(p[0])));
    const semiY = Math.max(...points.map((p) => Math.abs(p[1])));
    // The orbit's eccentricity (0.0167) makes the Sun's longitude non-uniform: 2 × e tolerance.
    expect(semiX).toBeCloseTo(1, 1);
    expect(Math.abs(semiX - 1)).toBeLessThan(0.035);
    expect(Math.abs(semiY - 0.5)).toBeLessThan(0.035 * 0.5 + 0.005);
    // Closed: the last sample is the first.
    expect(points[360][0]).toBeCloseTo(points[0][0], 12);
  });
});

describe('heat-map colours', () => {
  const palette = { negative: parseColour('#0000ff'), neutral: parseColour('#ffffff'), positive: parseColour('rgb(200, 0, 0)') };
  it('correlationColour maps 0, +1, −1 and +0.5 linearly between the palette colours', () => {
    expect(correlationColour(0, palette)).toBe('rgb(255, 255, 255)');
    expect(correlationColour(1, palette)).toBe('rgb(200, 0, 0)');
    expect(correlationColour(-1, palette)).toBe('rgb(0, 0, 255)');
    expect(correlationColour(0.5, palette)).toBe('rgb(228, 128, 128)');
  });
  it('correlationColour refuses a coefficient outside [−1, 1] instead of painting it as ±1', () => {
    expect(() => correlationColour(1.2, palette)).toThrow(/outside \[−1, 1\]/);
    expect(() => correlationColour(Number.NaN, palette)).toThrow(/outside/);
  });
  it('a red-only palette (the night theme) gives red-only cells for every coefficient', () => {
    const night = { negative: parseColour('#5a0000'), neutral: parseColour('#080000'), positive: parseColour('#c80000') };
    for (let r = -1; r <= 1; r += 0.01) expect(correlationColour(r, night)).toMatch(/^rgb\(\d+, 0, 0\)$/);
  });
  it('parseColour names a colour it cannot read', () => {
    expect(parseColour('#abc')).toEqual({ red: 0xaa, green: 0xbb, blue: 0xcc });
    expect(() => parseColour('oklch(0.5 0.1 30)')).toThrow(/not #rgb/);
  });
});

describe('night links', () => {
  it('hashForNight → nightIdFromHash round-trips an id with reserved characters', () => {
    const id = 'night 2021/01?04&x';
    expect(hashForNight(id)).toMatch(/^#\/archive\?night=/);
    expect(nightIdFromHash(hashForNight(id))).toBe(id);
  });
  it('nightIdFromHash gives null for other views and for an Archive hash without a night', () => {
    expect(nightIdFromHash('#/signatures?night=n1')).toBeNull();
    expect(nightIdFromHash('#/archive')).toBeNull();
    expect(nightIdFromHash('#/archive?night=')).toBeNull();
    expect(() => hashForNight('')).toThrow(/night id is empty/);
  });
  it('the router still reads the view from a night link (viewFromHash)', () => {
    expect(viewFromHash(hashForNight('night-2021-01-04'))).toBe('archive');
  });
});
