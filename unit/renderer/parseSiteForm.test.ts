import { describe, expect, test } from 'vitest';
import { parseSiteForm } from '../../renderer/archive/parseSiteForm.ts';

describe('parseSiteForm(text)', () => {
  test('accepts decimal degrees, east-positive longitude and a typographic minus', () => {
    expect(parseSiteForm({ label: ' Ridge pier ', latitudeDeg: '46.5', longitudeDeg: '−7.25', heightM: '1020' })).toEqual({
      kind: 'valid', draft: { label: 'Ridge pier', latitudeDeg: 46.5, longitudeDeg: -7.25, heightM: 1020 },
    });
  });

  test('refuses out-of-range values with the range and the value, never clamping', () => {
    const result = parseSiteForm({ label: 'X', latitudeDeg: '90.5', longitudeDeg: '181', heightM: '-600' });
    expect(result).toEqual({
      kind: 'invalid',
      errors: {
        latitudeDeg: 'Latitude must be between -90 and 90 degrees (north positive), got 90.5',
        longitudeDeg: 'Longitude must be between -180 and 180 degrees (east positive), got 181',
        heightM: 'Height must be between -500 and 9000 metres, got -600',
      },
    });
  });

  test('names empty and non-numeric fields', () => {
    const result = parseSiteForm({ label: '', latitudeDeg: '47°', longitudeDeg: '', heightM: '12' });
    expect(result.kind).toBe('invalid');
    if (result.kind !== 'invalid') return;
    expect(result.errors.label).toMatch(/Name the site/);
    expect(result.errors.latitudeDeg).toBe('Latitude must be a decimal number in degrees (north positive), got "47°"');
    expect(result.errors.longitudeDeg).toBe('Longitude is required');
    expect(result.errors.heightM).toBeUndefined();
  });
});
