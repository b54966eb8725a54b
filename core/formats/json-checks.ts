/** Collects problems found while validating a parsed JSON value, each with its JSON pointer. */
export class JsonChecker {
  readonly problems: { pointer: string; reason: string }[] = [];
  readonly warnings: string[] = [];

  fail(pointer: string, reason: string): null {
    this.problems.push({ pointer, reason });
    return null;
  }

  object(value: unknown, pointer: string, known: readonly string[]): Record<string, unknown> | null {
    if (typeof value !== 'object' || value === null || Array.isArray(value)) return this.fail(pointer, `expected an object, got ${describe(value)}`);
    const record = value as Record<string, unknown>;
    const extra = Object.keys(record).filter((k) => !known.includes(k));
    if (extra.length > 0) this.warnings.push(`${pointer || '/'}: unknown key(s) ignored: ${extra.join(', ')}`);
    return record;
  }

  array(value: unknown, pointer: string): unknown[] | null {
    return Array.isArray(value) ? value : this.fail(pointer, `expected an array, got ${describe(value)}`);
  }

  string(value: unknown, pointer: string, allowEmpty = false): string | null {
    if (typeof value !== 'string') return this.fail(pointer, `expected a string, got ${describe(value)}`);
    if (!allowEmpty && value.trim() === '') return this.fail(pointer, 'must not be empty');
    return value;
  }

  number(value: unknown, pointer: string, unit: string, min: number, max: number): number | null {
    if (typeof value !== 'number' || !Number.isFinite(value)) return this.fail(pointer, `expected a number in ${unit}, got ${describe(value)}`);
    if (value < min || value > max) return this.fail(pointer, `${value} ${unit} is outside [${min}, ${max}]`);
    return value;
  }

  choice<T extends string | number>(value: unknown, pointer: string, choices: readonly T[]): T | null {
    return (choices as readonly unknown[]).includes(value) ? (value as T) : this.fail(pointer, `expected one of ${choices.join(' | ')}, got ${describe(value)}`);
  }
}

/** Short description of a JSON value for messages. */
export function describe(value: unknown): string {
  if (value === undefined) return 'nothing (the key is missing)';
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  if (typeof value === 'object') return 'an object';
  const text = JSON.stringify(value);
  return text.length > 40 ? `${text.slice(0, 40)}…` : text;
}
