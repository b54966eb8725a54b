// The printable solve report (renderer/report/solveReportHtml.ts) built from a real saved solve:
// the demo archive's first nights solved by the worker's joint-solve task (unit/report/demoSolve.ts),
// so the checks see the record exactly as the Solve view saves it, not a hand-made one.
import { beforeAll, describe, expect, test } from 'vitest';
import type { ReductionRecord } from '../../core/archive/records.ts';
import { escapeHtml } from '../../renderer/report/escapeHtml.ts';
import { modelSettings } from '../../renderer/report/modelSettings.ts';
import { solveReportHtml, type SolveReportInput } from '../../renderer/report/solveReportHtml.ts';
import { savedConfiguration } from '../../renderer/solve/savedResults.ts';
import { demoSolveRecord } from './demoSolve.ts';

const HOSTILE = '<img src=x onerror="alert(1)">&\'';
let saved: ReductionRecord;
let results: Record<string, unknown>;
let html: string;
let input: SolveReportInput;

const record = (overrides: Partial<ReductionRecord> = {}): ReductionRecord => ({ ...saved, ...overrides });

beforeAll(async () => {
  saved = (await demoSolveRecord(60)).record;
  results = saved.results as Record<string, unknown>;
  const stars = results.stars as { id: string }[];
  input = {
    reduction: record(), archiveLabel: 'Invented test site (this browser)', appVersion: '9.8.7-test', generatedUtc: '2026-12-02T01:30:00.000Z',
    starLabels: new Map([[stars[0].id, HOSTILE]]),
  };
  html = solveReportHtml(input);
}, 120_000);

describe('solveReportHtml(input)', () => {
  test('has one star row per solved star, with its parallax as the solve gave it', () => {
    const doc = new DOMParserLike(html);
    const stars = results.stars as { id: string; parallaxMas: number | null }[];
    expect(stars.length).toBeGreaterThanOrEqual(2);
    expect(doc.count('<tr data-star-id=')).toBe(stars.length);
    for (const star of stars) {
      expect(html).toContain(`data-star-id="${escapeHtml(star.id)}"`);
      if (star.parallaxMas !== null) expect(html).toContain(star.parallaxMas.toFixed(2));
    }
  });
  test('lists every model setting with its value, and the versions and date', () => {
    const settings = modelSettings(savedConfiguration(saved).model);
    expect(settings.map((s) => s.name)).toEqual(expect.arrayContaining(['wireSigmaS', 'parallax', 'deltaKappa', 'catalogueSigma.default.positionMas']));
    for (const s of settings) expect(html).toContain(`<code>${escapeHtml(s.name)}</code>`);
    expect(html).toContain('Meridian Ledger 9.8.7-test');
    expect(html).toContain('2026-12-02 01:30 UTC');
    expect(html).toContain('every star; every instrument; all nights');
  });
  test('gives Δκ with its σ and significance, as the solve computed them', () => {
    const g = results.global as Record<string, number | null>;
    expect(g.deltaKappaArcsec).not.toBeNull();
    expect(html).toContain(`${g.deltaKappaArcsec!.toFixed(4)} ± ${g.deltaKappaSigmaArcsec!.toFixed(4)}`);
    expect(html).toContain(`${(g.deltaKappaArcsec! / g.deltaKappaSigmaArcsec!).toFixed(1)}σ`);
  });
  test('holds the degeneracy sentences and the plots as inline SVG', () => {
    for (const d of results.degeneracies as string[]) expect(html).toContain(escapeHtml(d));
    expect((html.match(/<svg /g) ?? []).length).toBeGreaterThanOrEqual(6);
    expect(html).toMatch(/@page \{ size: A4/);
  });
  test('escapes a hostile star label and a hostile solve label', () => {
    expect(html).not.toContain('<img');
    expect(html).toContain('&lt;img src=x onerror=&quot;alert(1)&quot;&gt;&amp;&#39;');
    const other = solveReportHtml({ ...input, reduction: record({ label: '</title><script>alert(2)</script>' }) });
    expect(other).not.toMatch(/<script/i);
    expect(other).toContain('&lt;/title&gt;&lt;script&gt;');
  });
  test('refers to no external resource: no URL, no src, no @import, no script', () => {
    expect(html).not.toMatch(/https?:\/\//i);
    expect(html).not.toMatch(/<[^>]*\b(src|href)\s*=/i); // inside a tag; the escaped hostile label is text
    expect(html).not.toMatch(/@import|<script|<link|<iframe|<object/i);
    expect(html).not.toMatch(/url\((?!#)/);
  });
  test('says which plots are missing instead of drawing them empty', () => {
    const bare = solveReportHtml({ ...input, reduction: record({ residuals: [], results: { ...record().results, residuals: [] } }) });
    expect(bare).toContain('the solve was saved without its residuals');
  });
});

/** Counting helper: Node has no DOMParser, and the checks only need substring counts. */
class DOMParserLike {
  constructor(private readonly text: string) {}
  count(needle: string): number {
    return this.text.split(needle).length - 1;
  }
}
