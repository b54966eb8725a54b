import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseTransitLog } from '../../core/formats/transit-log.ts';
import { parseStarList } from '../../core/formats/star-list.ts';
import { parseSiteDescription } from '../../core/formats/site-description.ts';

const doc = readFileSync(new URL('../../core/formats/FORMATS.md', import.meta.url), 'utf8');
function example(tag: string): Uint8Array {
  const match = new RegExp('```' + tag + '\\n([\\s\\S]*?)```').exec(doc);
  if (!match) throw new Error(`FORMATS.md has no example fenced as \`\`\`${tag}; the documentation and the parsers must agree`);
  return new TextEncoder().encode(match[1]);
}

describe('the examples in FORMATS.md parse cleanly (the documentation cannot drift from the code)', () => {
  it('star list', () => {
    const stars = parseStarList(example('csv star-list'), 'FORMATS.md');
    expect(stars.rejected).toEqual([]);
    expect(stars.warnings).toEqual([]);
    expect(stars.rows).toHaveLength(2);
    const log = parseTransitLog(example('csv transit-log'), { fileName: 'FORMATS.md', knownStarIds: new Set(stars.rows.map((s) => s.id)) });
    expect(log.rejected).toEqual([]);
    expect(log.rows).toHaveLength(2);
    expect(log.rows[1].note).toBe('wind, gusty');
  });
  it('site description', () => {
    const site = parseSiteDescription(example('json site'), 'FORMATS.md');
    expect(site.rejected).toEqual([]);
    expect(site.warnings).toEqual([]);
    expect(site.rows[0].instruments[0].wireIntervalsS).toHaveLength(5);
  });
});
