/** The site form's text fields as typed. */
export interface SiteFormText {
  readonly label: string;
  readonly latitudeDeg: string;
  readonly longitudeDeg: string;
  readonly heightM: string;
}

export interface SiteDraft {
  readonly label: string;
  readonly latitudeDeg: number;
  readonly longitudeDeg: number;
  readonly heightM: number;
}

export type SiteFormErrors = Partial<Record<keyof SiteFormText, string>>;

export type SiteFormResult =
  | { readonly kind: 'valid'; readonly draft: SiteDraft }
  | { readonly kind: 'invalid'; readonly errors: SiteFormErrors };

function parseNumber(text: string, name: string, min: number, max: number, unit: string): number | string {
  const trimmed = text.trim().replace(/^\u2212/, '-'); // accept a typographic minus
  if (trimmed === '') return `${name} is required`;
  const value = Number(trimmed);
  if (!Number.isFinite(value)) return `${name} must be a decimal number in ${unit}, got "${text}"`;
  if (value < min || value > max) return `${name} must be between ${min} and ${max} ${unit}, got ${value}`;
  return value;
}

/**
 * Checks the site form. Latitude and longitude are decimal degrees (east positive); height is
 * metres above the WGS84 ellipsoid, between −500 and 9000 (Dead Sea shore to the highest summit,
 * with margin). Out-of-range values are refused, never clamped.
 */
export function parseSiteForm(text: SiteFormText): SiteFormResult {
  const errors: SiteFormErrors = {};
  const label = text.label.trim();
  if (label === '') errors.label = 'Name the site (e.g. "North pier")';
  const latitudeDeg = parseNumber(text.latitudeDeg, 'Latitude', -90, 90, 'degrees (north positive)');
  const longitudeDeg = parseNumber(text.longitudeDeg, 'Longitude', -180, 180, 'degrees (east positive)');
  const heightM = parseNumber(text.heightM, 'Height', -500, 9000, 'metres');
  if (typeof latitudeDeg === 'string') errors.latitudeDeg = latitudeDeg;
  if (typeof longitudeDeg === 'string') errors.longitudeDeg = longitudeDeg;
  if (typeof heightM === 'string') errors.heightM = heightM;
  if (typeof latitudeDeg === 'string' || typeof longitudeDeg === 'string' || typeof heightM === 'string' || label === '') {
    return { kind: 'invalid', errors };
  }
  return { kind: 'valid', draft: { label, latitudeDeg, longitudeDeg, heightM } };
}
