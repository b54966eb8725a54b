// Loads unit/fixtures/erfa_time.json, written by unit/fixtures/erfa_time.py from ERFA (pyerfa).
// A missing fixture fails loudly with the command that makes it; it never skips.
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export interface ErfaUtcCase {
  calendar: [number, number, number, number, number, number];
  utc: [number, number];
  tai: [number, number];
  tt: [number, number];
  tdbMinusTtSeconds: number;
}

export interface ErfaEarthCase {
  tt: [number, number];
  ut1: [number, number];
  xpRad: number;
  ypRad: number;
  era00: number;
  gmst06: number;
  gst06a: number;
  ee06a: number;
  nut00a: [number, number];
  nut06a: [number, number];
  nut00b: [number, number];
  obl06: number;
  pmat06: number[];
  pnm06a: number[];
  sp00: number;
  pom00: number[];
}

export interface ErfaTimeFixture {
  header: { erfaVersion: string; pyerfaVersion: string; seed: number };
  utc: ErfaUtcCase[];
  earth: ErfaEarthCase[];
}

const path = fileURLToPath(new URL('../fixtures/erfa_time.json', import.meta.url));

export function loadErfaTimeFixture(): ErfaTimeFixture {
  if (!existsSync(path)) {
    throw new Error(`ERFA reference fixture ${path} is missing: run \`npm run fixtures\` (needs /usr/bin/python3 with python3-erfa)`);
  }
  return JSON.parse(readFileSync(path, 'utf8')) as ErfaTimeFixture;
}
