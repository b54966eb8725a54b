// The Solve view's pure pieces: degeneracy phrases beside their star, the instrument summary, the
// side-by-side comparison, the selection form and the model form's ranges.
import { describe, expect, it } from 'vitest';
import { DEFAULT_JOINT_MODEL, parseJointModel } from '../../core/joint/joint-model.ts';
import type { NightInstrumentTerms } from '../../core/joint/solve-outputs.ts';
import { compareSolves } from '../../renderer/solve/compareSolves.ts';
import { instrumentSummary } from '../../renderer/solve/instrumentSummary.ts';
import { LATITUDE_PERIOD_RANGE_DAYS, modelDifferences, modelProblems, NUMBER_FIELDS, parsePeriodsText, TERM_GROUPS } from '../../renderer/solve/modelTerms.ts';
import { degeneraciesOfStar, type SavedResults } from '../../renderer/solve/savedResults.ts';
import { EMPTY_SELECTION_FORM, selectionFromForm } from '../../renderer/solve/selectionForm.ts';

// Sentences in the shape core/joint/degeneracy-words.ts writes (checked in unit/joint/degeneracy.test.ts).
const REPORT = [
  'weak combination (condition index 66): parallax and proper motion in RA of star ML-001: seen only in August–December; position of star ML-012; Dec zero — left to the data',
  'weak combination (condition index 85): position of star ML-0012 — fixed by 2 prior(s)',
  'night block 4: clock, a cannot be separated; minimum norm used',
];

describe('degeneraciesOfStar(report, id)', () => {
  it('keeps only the phrases naming that star, with the status, and does not confuse ML-012 with ML-0012', () => {
    expect(degeneraciesOfStar(REPORT, 'ML-001')).toEqual(['weak: parallax and proper motion in RA: seen only in August–December']);
    expect(degeneraciesOfStar(REPORT, 'ML-012')).toEqual(['weak: position']);
    expect(degeneraciesOfStar(REPORT, 'ML-0012')).toEqual(['weak: position']);
    expect(degeneraciesOfStar(REPORT, 'ML-002')).toEqual([]);
  });
});

const night = (instrumentId: string, clockOffsetS: number, levelArcsec: number): NightInstrumentTerms => ({
  id: `${instrumentId}-${clockOffsetS}`, instrumentId, nightDateMjd: 60000, ttDaysSinceJ2000: 9000, temperatureC: 10, transits: 5,
  clockOffsetS, clockOffsetSigmaS: 0.001, clockRateSPerDay: 0, clockRateSigmaSPerDay: null, azimuthArcsec: 0, azimuthSigmaArcsec: null,
  levelArcsec, levelSigmaArcsec: null, collimationArcsec: 1, collimationSigmaArcsec: null, zeroPointArcsec: 0, zeroPointSigmaArcsec: null,
});

describe('instrumentSummary(series)', () => {
  it('gives per instrument the night count, mean and population scatter (hand-computed: 1, 2, 3 → mean 2, scatter √(2/3))', () => {
    const [a, b] = instrumentSummary([night('east', 1, 0), night('west', 5, 2), night('east', 2, 0), night('east', 3, 0)]);
    expect(a).toMatchObject({ instrumentId: 'east', nights: 3, transits: 15 });
    expect(a.clockOffsetS.mean).toBeCloseTo(2, 12);
    expect(a.clockOffsetS.scatter).toBeCloseTo(Math.sqrt(2 / 3), 12);
    expect(b).toMatchObject({ instrumentId: 'west', nights: 1, levelArcsec: { mean: 2, scatter: 0 } });
  });
});

const results = (stars: { id: string; p: number | null; sp: number | null }[]): SavedResults => ({
  stars: stars.map((s) => ({ id: s.id, observations: 10, parallaxMas: s.p, parallaxSigmaMas: s.sp, pmRaMasYr: 1, pmRaSigmaMasYr: 1, pmDecMasYr: 2, pmDecSigmaMasYr: 0,
    deltaRaMas: null, deltaRaSigmaMas: null, deltaDecMas: null, deltaDecSigmaMas: null })),
  global: {}, unitWeightError: 1, chiSquare: 1, degreesOfFreedom: 1, degeneracies: [], notes: [], instrumentSeries: [], starNights: {},
});

describe('compareSolves(first, second)', () => {
  it('puts second − first in units of √(σ₁² + σ₂²) (3−4−5: a difference of 5 with σ 3 and 4 is 1σ), and null where a σ is missing', () => {
    const rows = compareSolves(results([{ id: 'A', p: 10, sp: 3 }, { id: 'B', p: 1, sp: 1 }]), results([{ id: 'A', p: 15, sp: 4 }, { id: 'C', p: 2, sp: 1 }]));
    expect(rows.map((r) => r.id)).toEqual(['A', 'B', 'C']);
    expect(rows[0].parallaxSigmas).toBeCloseTo(1, 12);
    expect(rows[0].pmRaSigmas).toBe(0);
    expect(rows[0].pmDecSigmas).toBeNull(); // both σ zero: no scale to measure the difference in
    expect(rows[1].second).toBeNull();
    expect(rows[1].parallaxSigmas).toBeNull();
  });
});

describe('selectionFromForm(form)', () => {
  it('turns "every" into null, sorts the ticked ids and refuses one star, a bad date and a reversed span', () => {
    expect(selectionFromForm(EMPTY_SELECTION_FORM).selection).toEqual({ starIds: null, instrumentIds: null, fromDate: null, untilDate: null });
    const picked = selectionFromForm({ ...EMPTY_SELECTION_FORM, everyStar: false, starIds: ['B', 'A'], fromDate: '2020-01-01' });
    expect(picked.selection).toEqual({ starIds: ['A', 'B'], instrumentIds: null, fromDate: '2020-01-01', untilDate: null });
    const bad = selectionFromForm({ ...EMPTY_SELECTION_FORM, everyStar: false, starIds: ['A'], fromDate: '2021-05-01', untilDate: '2020-1-1' });
    expect(bad.selection).toBeNull();
    expect(bad.problems.join(' ')).toMatch(/two star ids.*Until date "2020-1-1".*after the until date/);
  });
});

describe('the model form', () => {
  it('lists every term and number key that parseJointModel knows, with the same ranges', () => {
    const keys = [...TERM_GROUPS.flatMap((g) => g.terms.map((t) => t.key)), ...NUMBER_FIELDS.map((f) => f.key)];
    // Every listed key is accepted by the model parser at both ends of the form's range.
    for (const f of NUMBER_FIELDS) {
      expect(parseJointModel(JSON.stringify({ [f.key]: f.min })).problems, f.key).toEqual([]);
      expect(parseJointModel(JSON.stringify({ [f.key]: f.max })).problems, f.key).toEqual([]);
    }
    for (const key of keys) expect(key in DEFAULT_JOINT_MODEL, key).toBe(true);
    expect(modelProblems(DEFAULT_JOINT_MODEL)).toEqual([]);
    expect(modelProblems({ ...DEFAULT_JOINT_MODEL, wireSigmaS: 0 })[0]).toMatch(/One wire crossing.*got 0/);
    expect(modelDifferences(DEFAULT_JOINT_MODEL, { ...DEFAULT_JOINT_MODEL, parallax: 'absent' })).toEqual(['Parallax: "free" → "absent"']);
  });
});

describe('modelProblems(model) for the catalogue priors', () => {
  it('refuses a catalogue σ of zero and names the field; a model with σ priors differs from the default in words', () => {
    const withPriors = { ...DEFAULT_JOINT_MODEL, catalogueSigma: { default: { positionMas: 0, pmMasYr: 0.7 }, stars: {} } };
    expect(modelProblems(withPriors)).toEqual(['Catalogue position, σ (mas) must be a number above 0 (got 0).']);
    expect(modelDifferences(DEFAULT_JOINT_MODEL, withPriors)).toEqual(['Catalogue precision: none → 0 mas and 0.7 mas/yr']);
  });
});

describe('parsePeriodsText(text) and the latitude-variation periods', () => {
  it('reads "433, 365.25" and "433 365.25" alike; a word becomes NaN so the form names it', () => {
    expect(parsePeriodsText('433, 365.25')).toEqual([433, 365.25]);
    expect(parsePeriodsText(' 433  365.25 ')).toEqual([433, 365.25]);
    expect(parsePeriodsText('433, 1e3')).toEqual([433, Number.NaN]);
    expect(parsePeriodsText('')).toEqual([]);
  });
  it('modelProblems names an out-of-range, missing or unreadable period only when the term is in the model', () => {
    const free = { ...DEFAULT_JOINT_MODEL, latitudeVariation: 'free' as const };
    expect(modelProblems(free)).toEqual([]);
    expect(modelProblems({ ...free, latitudeVariationPeriodsDays: [433, 12] })).toEqual(['Latitude-variation period 2 must be a number of days from 30 to 3000 (got 12).']);
    expect(modelProblems({ ...free, latitudeVariationPeriodsDays: parsePeriodsText('433, x') })[0]).toMatch(/period 2 .*not a number/);
    expect(modelProblems({ ...free, latitudeVariationPeriodsDays: [] })[0]).toMatch(/give 1 to 4 periods/);
    expect(modelProblems({ ...DEFAULT_JOINT_MODEL, latitudeVariationPeriodsDays: [] })).toEqual([]);
    // The form's range is the model parser's: both ends accepted, one step beyond refused.
    const { min, max } = LATITUDE_PERIOD_RANGE_DAYS;
    expect(parseJointModel(JSON.stringify({ latitudeVariationPeriodsDays: [min, max] })).problems).toEqual([]);
    expect(parseJointModel(JSON.stringify({ latitudeVariationPeriodsDays: [max + 1] })).problems).toHaveLength(1);
  });
});
