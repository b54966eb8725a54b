import { DAYTIME_THEME_STORAGE_KEY, parseTheme, THEME_STORAGE_KEY, type ThemeId } from './themes.ts';

/** Where the theme is kept and shown; tests pass their own. */
export interface ThemeHost {
  readonly storage: Pick<Storage, 'getItem' | 'setItem'> | null;
  /** Receives the theme to show (the app sets `data-theme` on <html>). */
  apply(theme: ThemeId): void;
}

/**
 * The chosen theme, persisted. Alt+N toggles night mode and returns to whichever of day and dark
 * was chosen before, so the toggle never forgets the daytime choice.
 */
export class ThemeState {
  theme = $state<ThemeId>('day');
  /** Set when the choice could not be saved (storage blocked or full); shown to the user. */
  saveProblem = $state<string | null>(null);
  #daytimeTheme: Exclude<ThemeId, 'night'> = 'day';
  readonly #host: ThemeHost;

  constructor(host: ThemeHost) {
    this.#host = host;
    const daytime = parseTheme(this.#read(DAYTIME_THEME_STORAGE_KEY));
    if (daytime !== null && daytime !== 'night') this.#daytimeTheme = daytime;
    this.#show(parseTheme(this.#read(THEME_STORAGE_KEY)) ?? this.#daytimeTheme);
  }

  choose(theme: ThemeId): void {
    this.#show(theme);
    try {
      this.#host.storage?.setItem(THEME_STORAGE_KEY, theme);
      this.#host.storage?.setItem(DAYTIME_THEME_STORAGE_KEY, this.#daytimeTheme);
      this.saveProblem = null;
    } catch (error) {
      this.saveProblem = `The theme could not be saved (${String(error)}); it will reset on reload.`;
    }
  }

  toggleNight(): void {
    this.choose(this.theme === 'night' ? this.#daytimeTheme : 'night');
  }

  #show(theme: ThemeId): void {
    this.theme = theme;
    if (theme !== 'night') this.#daytimeTheme = theme;
    this.#host.apply(theme);
  }

  #read(key: string): string | null {
    try {
      return this.#host.storage?.getItem(key) ?? null;
    } catch {
      return null; // blocked storage: start in the day theme, as the boot script did
    }
  }
}
