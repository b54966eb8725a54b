import { describe, expect, test } from 'vitest';
import { hashForView, neighbourView, viewFromHash, VIEW_IDS } from '../../renderer/navigation/views.ts';
import { shortcutFor, type KeyPress } from '../../renderer/navigation/keyboardShortcuts.ts';
import { ViewRouter, type HashHost } from '../../renderer/navigation/router.svelte.ts';

function fakeHost(initialHash: string) {
  const listeners: (() => void)[] = [];
  const host: HashHost & { fire(): void } = {
    location: { hash: initialHash },
    addEventListener: (_type, listener) => listeners.push(listener),
    fire: () => listeners.forEach((listener) => listener()),
  };
  return host;
}

const press = (code: string, modifiers: Partial<KeyPress> = {}): KeyPress => ({
  key: '', code, altKey: true, ctrlKey: false, metaKey: false, shiftKey: false, ...modifiers,
});

describe('views', () => {
  test('the five views of DESIGN.md §6, in order', () => {
    expect(VIEW_IDS).toEqual(['tonight', 'archive', 'solve', 'signatures', 'exchange']);
  });

  test('viewFromHash(hash) reads #/name and #name, ignores case and tails, rejects unknown names', () => {
    expect(viewFromHash('#/archive')).toBe('archive');
    expect(viewFromHash('#Solve')).toBe('solve');
    expect(viewFromHash('#/signatures/star-12?x=1')).toBe('signatures');
    expect(viewFromHash('')).toBeNull();
    expect(viewFromHash('#/settings')).toBeNull();
    expect(viewFromHash(hashForView('exchange'))).toBe('exchange');
  });

  test('neighbourView(view, steps) wraps at both ends', () => {
    expect(neighbourView('exchange', 1)).toBe('tonight');
    expect(neighbourView('tonight', -1)).toBe('exchange');
    expect(neighbourView('archive', 7)).toBe('signatures');
  });
});

describe('shortcutFor(press)', () => {
  test('Alt+1 … Alt+5 open the views by physical key; Alt+6 and plain digits do nothing', () => {
    expect(VIEW_IDS.map((_, index) => shortcutFor(press(`Digit${index + 1}`)))).toEqual(
      VIEW_IDS.map((view) => ({ kind: 'open-view', view })),
    );
    expect(shortcutFor(press('Digit6'))).toBeNull();
    expect(shortcutFor(press('Digit1', { altKey: false }))).toBeNull();
  });

  test('Alt+N toggles night mode; with Ctrl, Shift or Meta it is not ours', () => {
    expect(shortcutFor(press('KeyN'))).toEqual({ kind: 'toggle-night' });
    expect(shortcutFor(press('KeyN', { ctrlKey: true }))).toBeNull();
    expect(shortcutFor(press('KeyN', { shiftKey: true }))).toBeNull();
    expect(shortcutFor(press('KeyN', { metaKey: true }))).toBeNull();
  });
});

describe('ViewRouter', () => {
  test('starts from the hash, follows hashchange, and writes the hash on go()', () => {
    const host = fakeHost('#/solve');
    const router = new ViewRouter(host);
    expect(router.current).toBe('solve');
    host.location.hash = '#/archive';
    host.fire();
    expect(router.current).toBe('archive');
    router.go('exchange');
    expect(host.location.hash).toBe('#/exchange');
  });

  test('an unknown hash shows Tonight and rewrites the hash', () => {
    const host = fakeHost('#/nowhere');
    const router = new ViewRouter(host);
    expect(router.current).toBe('tonight');
    expect(host.location.hash).toBe('#/tonight');
  });
});
