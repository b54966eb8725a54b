/**
 * Every setting of a saved model as "name → value" lines, nested objects flattened with dots
 * (`catalogueSigma.default.positionMas`), lists joined by commas, in the model's own key order.
 * Generic on purpose: a term added to the model later is printed without touching the report.
 */
export function modelSettings(model: unknown, prefix = ''): { name: string; value: string }[] {
  if (model === null || typeof model !== 'object' || Array.isArray(model)) return [{ name: prefix || '(model)', value: settingText(model) }];
  const entries = Object.entries(model as Record<string, unknown>);
  if (entries.length === 0) return [{ name: prefix || '(model)', value: 'none' }];
  return entries.flatMap(([key, value]) => {
    const name = prefix === '' ? key : `${prefix}.${key}`;
    return value !== null && typeof value === 'object' && !Array.isArray(value) ? modelSettings(value, name) : [{ name, value: settingText(value) }];
  });
}

function settingText(value: unknown): string {
  if (value === null || value === undefined) return 'none';
  if (Array.isArray(value)) return value.length === 0 ? 'none' : value.map((v) => settingText(v)).join(', ');
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}
