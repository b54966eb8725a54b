import { parseColour, type HeatPalette } from './heatColour.ts';
import type { PlotColours } from './plotLayout.ts';

function read(style: CSSStyleDeclaration, name: string): string {
  const value = style.getPropertyValue(name).trim();
  if (value === '') throw new Error(`The theme defines no ${name}; add it to renderer/styles/themes.css for every theme.`);
  return value;
}

function resolve(): { plot: PlotColours; heat: HeatPalette } {
  const style = getComputedStyle(document.documentElement);
  const [surface, text, muted, border, accent, danger] = ['--surface', '--text', '--text-muted', '--border', '--accent', '--danger'].map((name) => read(style, name));
  return {
    plot: { background: surface, text, muted, grid: border, tones: { main: accent, second: muted, flagged: danger, muted: border } },
    heat: { negative: parseColour(danger), neutral: parseColour(surface), positive: parseColour(accent) },
  };
}

/**
 * The plot colours, read from the theme's CSS variables (so the night theme's red-only rule holds
 * on the canvas too) and read again whenever <html data-theme> changes.
 */
export class ThemeColours {
  current = $state.raw(resolve());

  /** Starts following theme changes; returns the function that stops. */
  follow(): () => void {
    const observer = new MutationObserver(() => (this.current = resolve()));
    observer.observe(document.documentElement, { attributes: true, attributeFilter: ['data-theme'] });
    return () => observer.disconnect();
  }
}
