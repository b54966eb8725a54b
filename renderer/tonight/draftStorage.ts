/**
 * What survives a closed window besides the store: the half-typed entry and the choices of the
 * Tonight view, in localStorage (per browser profile; the accepted entries are in the archive).
 */
export interface LogDraft {
  readonly starCatalogueId: string;
  readonly wiresText: string;
  readonly readingText: string;
}

export interface TonightChoices {
  readonly siteId: string;
  readonly instrumentId: string;
  readonly nightDate: string;
  readonly zeroPointText: string;
  readonly clockOffsetText: string;
  readonly timeToleranceText: string;
  readonly zenithToleranceText: string;
  readonly clamp: 'west' | 'east' | 'none';
}

const DRAFT_KEY = 'meridian-ledger:tonight-draft';
const CHOICES_KEY = 'meridian-ledger:tonight-choices';

export const EMPTY_DRAFT: LogDraft = { starCatalogueId: '', wiresText: '', readingText: '' };

function read<T extends object>(key: string, fallback: T): T {
  try {
    const text = localStorage.getItem(key);
    if (text === null) return fallback;
    const value: unknown = JSON.parse(text);
    // Only known keys of the right type are taken; anything else falls back field by field.
    if (typeof value !== 'object' || value === null) return fallback;
    const picked = Object.fromEntries(Object.entries(fallback).map(([name, initial]) => {
      const stored = (value as Record<string, unknown>)[name];
      return [name, typeof stored === typeof initial ? stored : initial];
    }));
    return picked as T;
  } catch {
    return fallback;
  }
}

export const loadDraft = (): LogDraft => read(DRAFT_KEY, EMPTY_DRAFT);
export const saveDraft = (draft: LogDraft): void => localStorage.setItem(DRAFT_KEY, JSON.stringify(draft));
export const loadChoices = (fallback: TonightChoices): TonightChoices => read(CHOICES_KEY, fallback);
export const saveChoices = (choices: TonightChoices): void => localStorage.setItem(CHOICES_KEY, JSON.stringify(choices));
