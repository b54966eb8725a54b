import { describe, expect, test } from 'vitest';
import { ThemeState } from '../../renderer/theme/themeState.svelte.ts';
import { DAYTIME_THEME_STORAGE_KEY, THEME_STORAGE_KEY, type ThemeId } from '../../renderer/theme/themes.ts';
import { readFileSync } from 'node:fs';

function memoryStorage(initial: Record<string, string> = {}) {
  const values = new Map(Object.entries(initial));
  return {
    values,
    getItem: (key: string) => values.get(key) ?? null,
    setItem: (key: string, value: string) => void values.set(key, value),
  };
}

describe('ThemeState', () => {
  test('starts in the saved theme and applies it', () => {
    const applied: ThemeId[] = [];
    const state = new ThemeState({ storage: memoryStorage({ [THEME_STORAGE_KEY]: 'night' }), apply: (t) => applied.push(t) });
    expect(state.theme).toBe('night');
    expect(applied).toEqual(['night']);
  });

  test('toggleNight() returns to the daytime theme chosen before, also after a restart', () => {
    const storage = memoryStorage();
    const first = new ThemeState({ storage, apply: () => {} });
    first.choose('dark');
    first.toggleNight();
    expect(storage.values.get(THEME_STORAGE_KEY)).toBe('night');
    expect(storage.values.get(DAYTIME_THEME_STORAGE_KEY)).toBe('dark');
    const restarted = new ThemeState({ storage, apply: () => {} });
    expect(restarted.theme).toBe('night');
    restarted.toggleNight();
    expect(restarted.theme).toBe('dark');
  });

  test('a garbage saved value falls back to day; a failing save is reported, not thrown', () => {
    const broken = {
      getItem: () => 'purple',
      setItem: () => { throw new DOMException('quota', 'QuotaExceededError'); },
    };
    const state = new ThemeState({ storage: broken, apply: () => {} });
    expect(state.theme).toBe('day');
    state.choose('night');
    expect(state.theme).toBe('night');
    expect(state.saveProblem).toMatch(/could not be saved .*QuotaExceededError|could not be saved .*quota/);
  });

  test('the boot script reads the same storage key and theme names', () => {
    const boot = readFileSync(new URL('../../renderer/public/theme-boot.js', import.meta.url), 'utf8');
    expect(boot).toContain(`'${THEME_STORAGE_KEY}'`);
    for (const theme of ['day', 'dark', 'night']) expect(boot).toContain(`'${theme}'`);
  });
});

describe('night palette', () => {
  test('every colour of the night theme in themes.css has green = blue = 0', () => {
    const css = readFileSync(new URL('../../renderer/styles/themes.css', import.meta.url), 'utf8');
    const night = css.match(/:root\[data-theme='night'\]\s*\{([^}]*)\}/)?.[1];
    if (night === undefined) throw new Error("themes.css has no :root[data-theme='night'] block");
    const colours = [...night.matchAll(/#([0-9a-f]{6})\b/gi)].map((match) => match[1]);
    expect(colours.length).toBeGreaterThan(10);
    expect(colours.filter((hex) => hex.slice(2) !== '0000')).toEqual([]);
    expect(night).not.toMatch(/rgb|hsl|oklch|#[0-9a-f]{3}\b/i);
  });
});
