// The archive folder: records → files → records and files → records → files, and the refusals.
import { beforeAll, describe, expect, it } from 'vitest';
import { encodeFolderFiles, readArchiveFolder, writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import { simulateArchive, type SimulatedArchive } from '../../core/simulate/simulate-archive.ts';

const STAMP = '2000-01-01T00:00:00.000Z';
let archive: SimulatedArchive;
let files: Map<string, string>;

beforeAll(async () => {
  archive = await simulateArchive({ seed: 21, years: 2, starCount: 14, blunderRate: 0.02 }, undefined, STAMP);
  files = writeArchiveFolder(archive, archive.truth);
});

const byId = <T extends { id: string }>(rows: readonly T[]) => [...rows].sort((a, b) => (a.id < b.id ? -1 : 1));
/** NaN (a missed wire) compares equal to NaN in toEqual; JSON would hide it as null. */
function withFileEdit(path: string, edit: (text: string) => string): Map<string, Uint8Array> {
  const copy = new Map(files);
  copy.set(path, edit(copy.get(path)!));
  return encodeFolderFiles(copy);
}

describe('writeArchiveFolder / readArchiveFolder', () => {
  it('writes the documented files: identity, site, stars, nights, readings, one transit log per year, truth', () => {
    expect([...files.keys()].sort()).toEqual([
      'archive.json', 'clock-comparisons.csv', 'collimation-readings.csv', 'level-readings.csv', 'nights.csv', 'site.json', 'stars.csv',
      'transits/2021.csv', 'transits/2022.csv', 'truth.json',
    ]);
  });

  it('records → folder → records is exact for a simulated archive (every field, NaN for missed wires kept)', () => {
    const read = readArchiveFolder(encodeFolderFiles(files), STAMP);
    expect(read.rejected).toEqual([]);
    expect(read.warnings).toEqual([]);
    const content = read.content!;
    expect(content.site).toEqual(archive.site);
    expect(content.instruments).toEqual(archive.instruments);
    expect(byId(content.events)).toEqual(byId(archive.events));
    expect(byId(content.stars)).toEqual(byId(archive.stars));
    expect(byId(content.nights)).toEqual(byId(archive.nights));
    expect(content.transits.length).toBe(archive.transits.length);
    expect(byId(content.transits)).toEqual(byId(archive.transits));
    expect(archive.transits.some((t) => t.wireClockMjd.some(Number.isNaN))).toBe(true);
    expect(JSON.stringify(read.truth)).toBe(JSON.stringify(archive.truth));
  });

  it('keeps a star\'s stated position and proper-motion σ through the folder, and leaves them out where unknown', () => {
    const stars = [{ ...archive.stars[0], positionErrorMas: 0.05, pmErrorMasYr: 0.07 }, ...archive.stars.slice(1)];
    const read = readArchiveFolder(encodeFolderFiles(writeArchiveFolder({ ...archive, stars }, archive.truth)), STAMP);
    expect(read.rejected).toEqual([]);
    expect(byId(read.content!.stars)).toEqual(byId(stars));
    const first = read.content!.stars.find((s) => s.id === archive.stars[0].id)!;
    expect([first.positionErrorMas, first.pmErrorMasYr]).toEqual([0.05, 0.07]);
    const other = read.content!.stars.find((s) => s.id === archive.stars[1].id)!;
    expect('positionErrorMas' in other || 'pmErrorMasYr' in other).toBe(false);
  });

  it('keeps the clamp position of each transit through the folder (east, west, or none for an instrument not reversed)', () => {
    const [first, second, ...rest] = archive.transits;
    const transits = [{ ...first, clamp: 'east' as const }, { ...second, clamp: 'west' as const }, ...rest];
    const read = readArchiveFolder(encodeFolderFiles(writeArchiveFolder({ ...archive, transits }, archive.truth)), STAMP);
    expect(read.rejected).toEqual([]);
    const back = new Map(read.content!.transits.map((t) => [t.id, t]));
    expect(back.get(first.id)!.clamp).toBe('east');
    expect(back.get(second.id)!.clamp).toBe('west');
    expect('clamp' in back.get(rest[0].id)!).toBe(false);
  });

  it('folder → records → folder gives the same files byte for byte', () => {
    const read = readArchiveFolder(encodeFolderFiles(files), STAMP);
    const again = writeArchiveFolder(read.content!, read.truth);
    expect([...again.keys()].sort()).toEqual([...files.keys()].sort());
    for (const [path, text] of files) expect(again.get(path), path).toBe(text);
  });

  it('keeps event kinds the site format spells differently (collimation, repair, clock changes)', () => {
    const site = JSON.parse(files.get('site.json')!);
    site.instruments[0].events.push({ date: '2022-06-01', kind: 'repair', note: 'new pivot bearing' }, { date: '2022-06-02', kind: 'collimation', note: '' });
    const edited = new Map(files);
    edited.set('site.json', `${JSON.stringify(site, null, 2)}\n`);
    const read = readArchiveFolder(encodeFolderFiles(edited), STAMP);
    expect(read.rejected).toEqual([]);
    const added = (events: readonly { kind: string; note: string; date?: string; utcMjd?: number }[]) =>
      events.filter((e) => e.note.includes('pivot') || (e.note === '' && e.kind.includes('collimation'))).map((e) => [e.kind, e.note]);
    expect(added(read.content!.events)).toEqual([['other', 'repair — new pivot bearing'], ['recollimation', '']]);
    const rewritten = JSON.parse(writeArchiveFolder(read.content!).get('site.json')!);
    expect(added(rewritten.instruments[0].events)).toEqual([['repair', 'new pivot bearing'], ['collimation', '']]);
    expect(read.content!.events.filter((e) => e.kind === 'clock-change').length).toBe(archive.events.filter((e) => e.kind === 'clock-change').length);
  });

  it('reports every refused row with file, row, line, column and reason', () => {
    const folder = withFileEdit('transits/2021.csv', (text) => {
      const lines = text.split('\n');
      lines[1] = lines[1].replace(/^([^,]+),upper,/, '$1,sideways,').replace(/^([^,]+),lower,/, '$1,sideways,');
      lines[2] = lines[2].replace(/^ML-\d{3}/, 'ML-999');
      return lines.join('\n');
    });
    const read = readArchiveFolder(folder, STAMP);
    expect(read.rejected).toEqual([
      expect.objectContaining({ file: 'transits/2021.csv', row: 1, line: 2, column: 'culmination', reason: expect.stringContaining('upper | lower') }),
      expect.objectContaining({ file: 'transits/2021.csv', row: 2, line: 3, column: 'starId', reason: expect.stringContaining("unknown star id 'ML-999'") }),
    ]);
    expect(read.content!.transits.length).toBe(archive.transits.length - 2);
  });

  it('refuses a transit whose night is not in nights.csv, and a reading of a missing night', () => {
    const firstNight = archive.nights.map((n) => n.id).sort()[0];
    const folder = withFileEdit('nights.csv', (text) => text.split('\n').filter((l) => !l.startsWith(`${firstNight},`)).join('\n'));
    const read = readArchiveFolder(folder, STAMP);
    const transitRows = read.rejected.filter((r) => r.file.startsWith('transits/'));
    expect(transitRows.length).toBe(archive.transits.filter((t) => t.nightId === firstNight).length);
    expect(transitRows[0]).toMatchObject({ column: 'nightDate', reason: expect.stringContaining('nights.csv') });
    expect(read.rejected.some((r) => r.file === 'clock-comparisons.csv' && r.column === 'nightDate' && r.reason.includes('nights.csv'))).toBe(true);
    expect(read.rejected.some((r) => r.file === 'level-readings.csv' && r.column === 'nightId')).toBe(true);
  });

  it('refuses a folder without its identity file or with a newer format version, naming the file', () => {
    const missing = encodeFolderFiles(files);
    missing.delete('archive.json');
    expect(readArchiveFolder(missing, STAMP)).toMatchObject({ content: null, rejected: [{ file: 'archive.json', reason: expect.stringContaining('missing') }] });
    const newer = withFileEdit('archive.json', () => '{"format":"meridian-ledger-archive-folder","formatVersion":2}\n');
    expect(readArchiveFolder(newer, STAMP).rejected[0]).toMatchObject({ column: '/formatVersion', reason: expect.stringContaining('version 2') });
  });

  it('refuses to write what the file formats cannot hold, naming the record', () => {
    const twoReadings = { ...archive, transits: [{ ...archive.transits[0], zenithReadings: [1, 2] }] };
    expect(() => writeArchiveFolder(twoReadings)).toThrow(new RegExp(`transit ${archive.transits[0].id.replace(/\//g, '\\/')} has 2 zenith readings`));
    const idMismatch = { ...archive, stars: [{ ...archive.stars[0], id: 'uuid-1' }] };
    expect(() => writeArchiveFolder(idMismatch)).toThrow(/star uuid-1 has catalogue id/);
  });
});
