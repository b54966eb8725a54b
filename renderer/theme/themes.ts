/** The colour themes. `night` is the dim deep-red mode that keeps the observer's dark adaptation. */
export const THEME_IDS = ['day', 'dark', 'night'] as const;
export type ThemeId = (typeof THEME_IDS)[number];

export const THEME_LABELS: Readonly<Record<ThemeId, string>> = {
  day: 'Day',
  dark: 'Dark',
  night: 'Night (red)',
};

/** localStorage key; renderer/public/theme-boot.js reads the same key before the first paint. */
export const THEME_STORAGE_KEY = 'meridian-ledger.theme';

/** Which of day and dark Alt+N returns to from night mode, kept across reloads. */
export const DAYTIME_THEME_STORAGE_KEY = 'meridian-ledger.daytime-theme';

export function parseTheme(value: string | null): ThemeId | null {
  return value !== null && (THEME_IDS as readonly string[]).includes(value) ? (value as ThemeId) : null;
}
