/** A parsed cell: the value, or the reason it could not be read. */
export type CellResult<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly reason: string };

const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * A decimal number written with a point (1.25, -3e-4); no thousands separators, no comma
 * decimals, no NaN or Infinity: the unit comes from the header name, never from the cell.
 * Range [min, max] inclusive; the reason names the column's unit.
 */
export function parseNumberCell(text: string, unitLabel: string, min: number, max: number): CellResult<number> {
  const trimmed = text.trim();
  if (!DECIMAL.test(trimmed)) {
    const hint = /^\s*[+-]?\d+,\d+\s*$/.test(text) ? ' (use a point as the decimal separator)' : '';
    return { ok: false, reason: `'${text}' is not a number${hint}; expected ${unitLabel}` };
  }
  const value = Number(trimmed);
  if (!Number.isFinite(value)) return { ok: false, reason: `'${text}' overflows; expected ${unitLabel}` };
  if (value < min || value > max) return { ok: false, reason: `${value} is outside the possible range [${min}, ${max}] ${unitLabel}` };
  return { ok: true, value };
}

/** One of a fixed set of words (case-sensitive, as documented in FORMATS.md). */
export function parseChoiceCell<T extends string>(text: string, choices: readonly T[]): CellResult<T> {
  const trimmed = text.trim();
  return (choices as readonly string[]).includes(trimmed)
    ? { ok: true, value: trimmed as T }
    : { ok: false, reason: `'${text}' is not one of ${choices.join(' | ')}` };
}

/** Days in a Gregorian month. */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

/**
 * Modified Julian Date of a Gregorian calendar date (integer), by the Fliegel–Van Flandern
 * algorithm (Communications of the ACM 11, 657, 1968), valid for every Gregorian date after
 * −4800 March 1.
 */
export function mjdFromCalendar(year: number, month: number, day: number): number {
  const a = Math.trunc((14 - month) / 12);
  const y = year + 4800 - a;
  const m = month + 12 * a - 3;
  const jdn = day + Math.trunc((153 * m + 2) / 5) + 365 * y + Math.trunc(y / 4) - Math.trunc(y / 100) + Math.trunc(y / 400) - 32045;
  return jdn - 2_400_001;
}

/** A calendar date 'YYYY-MM-DD' (years 1600–2500) → MJD, with the reason on failure. */
export function parseDateCell(text: string): CellResult<number> {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text.trim());
  if (!match) return { ok: false, reason: `'${text}' is not a date YYYY-MM-DD` };
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  if (year < 1600 || year > 2500) return { ok: false, reason: `year ${year} is outside 1600–2500` };
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return { ok: false, reason: `'${text}' is not a calendar date` };
  return { ok: true, value: mjdFromCalendar(year, month, day) };
}
