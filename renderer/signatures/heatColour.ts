/** An sRGB colour, channels 0–255. */
export interface Rgb {
  readonly red: number;
  readonly green: number;
  readonly blue: number;
}

/**
 * Parses a CSS colour as the theme variables and getComputedStyle give it: `#rgb`, `#rrggbb` or
 * `rgb(r, g, b)` / `rgba(…)`. Throws naming the text otherwise (a theme variable must be one of these).
 */
export function parseColour(text: string): Rgb {
  const t = text.trim();
  const hex = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(t);
  if (hex) {
    const h = hex[1].length === 3 ? hex[1].replace(/./g, (c) => c + c) : hex[1];
    return { red: parseInt(h.slice(0, 2), 16), green: parseInt(h.slice(2, 4), 16), blue: parseInt(h.slice(4, 6), 16) };
  }
  const rgb = /^rgba?\(\s*([\d.]+)[\s,]+([\d.]+)[\s,]+([\d.]+)/i.exec(t);
  if (rgb) return { red: Number(rgb[1]), green: Number(rgb[2]), blue: Number(rgb[3]) };
  throw new Error(`parseColour: "${text}" is not #rgb, #rrggbb or rgb(); set the theme variable to one of these.`);
}

/** Linear mix of two colours, t = 0 → a, 1 → b, as `rgb(r, g, b)` with rounded channels. */
export function mixColour(a: Rgb, b: Rgb, t: number): string {
  const m = (x: number, y: number) => Math.round(x + (y - x) * t);
  return `rgb(${m(a.red, b.red)}, ${m(a.green, b.green)}, ${m(a.blue, b.blue)})`;
}

export interface HeatPalette {
  readonly negative: Rgb;
  readonly neutral: Rgb;
  readonly positive: Rgb;
}

/**
 * Colour of a correlation coefficient on the heat map: 0 → neutral (the plot's background), +1 →
 * positive, −1 → negative, linear in |r| between. Each channel stays between the palette's, so a
 * red-only palette (night theme) gives red-only cells. Throws for |r| > 1 + 1e-9 or NaN: a
 * correlation outside [−1, 1] means a broken covariance, which must not be painted as ±1.
 */
export function correlationColour(r: number, palette: HeatPalette): string {
  if (!(Math.abs(r) <= 1 + 1e-9)) throw new Error(`correlationColour: correlation ${r} is outside [−1, 1]; the saved covariance is broken — solve again.`);
  const magnitude = Math.min(1, Math.abs(r));
  return mixColour(palette.neutral, r >= 0 ? palette.positive : palette.negative, magnitude);
}
