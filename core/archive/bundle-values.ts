/**
 * JSON for archive rows that round-trips every value bit-exactly. Finite doubles already do
 * (JSON.stringify writes the shortest text that parses back to the same double, ECMA-262
 * Number::toString); the values JSON cannot hold — −0, NaN, ±Infinity — are written as
 * `{"$number": "-0"}` and so on, and turned back on reading.
 */
const SPECIAL_KEY = '$number';

function encodeValue(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && (!Number.isFinite(value) || Object.is(value, -0))) {
    return { [SPECIAL_KEY]: Object.is(value, -0) ? '-0' : String(value) };
  }
  return value;
}

const SPECIAL_VALUES: Record<string, number> = { '-0': -0, NaN: Number.NaN, Infinity: Number.POSITIVE_INFINITY, '-Infinity': Number.NEGATIVE_INFINITY };

function decodeValue(_key: string, value: unknown): unknown {
  if (typeof value === 'object' && value !== null && !Array.isArray(value)) {
    const keys = Object.keys(value);
    if (keys.length === 1 && keys[0] === SPECIAL_KEY) {
      const text = (value as Record<string, unknown>)[SPECIAL_KEY];
      if (typeof text === 'string' && text in SPECIAL_VALUES) return SPECIAL_VALUES[text];
      throw new SyntaxError(`unknown special number ${JSON.stringify(text)}`);
    }
  }
  return value;
}

/**
 * True when `value` holds −0, NaN or ±Infinity anywhere JSON.stringify would look, or anything
 * other than plain objects, arrays and primitives (then the replacer path decides, as before).
 */
function mayNeedReplacer(value: unknown): boolean {
  if (typeof value === 'number') return !Number.isFinite(value) || Object.is(value, -0);
  if (typeof value !== 'object' || value === null) return false;
  if (Array.isArray(value)) {
    for (const item of value) if (mayNeedReplacer(item)) return true;
    return false;
  }
  const prototype: unknown = Object.getPrototypeOf(value);
  if (prototype !== Object.prototype && prototype !== null) return true;
  for (const key in value) {
    if (Object.hasOwn(value, key) && mayNeedReplacer((value as Record<string, unknown>)[key])) return true;
  }
  return false;
}

/**
 * One row as one line of JSON (no newline inside: JSON.stringify escapes control characters).
 * The replacer only rewrites special numbers, so a row without any is written by plain
 * JSON.stringify, to the same text (the replacer, called for every value, was most of the cost).
 */
export function rowToJsonLine(row: unknown): string {
  return mayNeedReplacer(row) ? JSON.stringify(row, encodeValue) : JSON.stringify(row);
}

/**
 * One line back to its row. The reviver runs only when the line can hold a special number: a
 * `$number` key is written either plainly or with a \u escape, so a line with neither parses the
 * same without it (and the reviver, called for every value, is most of the cost of a restore).
 */
export function jsonLineToRow(line: string): unknown {
  return line.includes(SPECIAL_KEY) || line.includes('\\u') ? JSON.parse(line, decodeValue) : JSON.parse(line);
}
