import type { HeatPalette } from '../signatures/heatColour.ts';
import type { PlotColours } from '../signatures/plotLayout.ts';

/**
 * The report's colours: ink on white paper whatever theme the screen is in (a night-mode report
 * printed red on black would waste toner and read badly). Chosen for this report: a dark slate
 * for the main series, a warm brown for the second, a brick red for flagged points, greys for
 * grid and muted marks — all distinguishable in greyscale by lightness.
 */
export const PRINT_PLOT_COLOURS: PlotColours = {
  background: '#ffffff', text: '#1a1a1a', muted: '#6b6b6b', grid: '#d4d4d4',
  tones: { main: '#23395b', second: '#8a5a2b', flagged: '#b0302a', muted: '#a8a8a8' },
};

export const PRINT_HEAT_PALETTE: HeatPalette = {
  negative: { red: 176, green: 48, blue: 42 },
  neutral: { red: 255, green: 255, blue: 255 },
  positive: { red: 35, green: 57, blue: 91 },
};
