// The default model (SOLVE.md "Defaults"): temperature free when the archive records temperatures,
// held at 0 with a note when it records none (every transit at the reference temperature); a
// simulated archive's geometry with its O − C as the nightly reduction gave them.
import { beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_JOINT_MODEL } from '../../core/joint/joint-model.ts';
import type { PreparedArchive } from '../../core/joint/prepare-archive.ts';
import { solvePrepared } from '../../core/joint/solve-archive.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { preparedGeometry } from './synthetic-observations.ts';

let prepared: PreparedArchive;
let model: Awaited<ReturnType<typeof preparedGeometry>>['model'];
beforeAll(async () => { ({ prepared, model } = await preparedGeometry({ seed: 31, years: 2, starCount: 8, blunderRate: 0 })); }, 120_000);

describe('default model', () => {
  it('has temperature free and every instrument term per night', () => {
    expect(DEFAULT_JOINT_MODEL.temperature).toBe('free');
    expect(Object.values(DEFAULT_JOINT_MODEL.termSpan).every((s) => s === 'per-night')).toBe(true);
  });

  it('estimates the temperature coefficients when temperatures are recorded, and holds them with a note when none are', () => {
    const withReadings = solvePrepared(prepared, model, UNCONTROLLED);
    expect(withReadings.global.temperatureRaSigmaArcsecPerC).toBeGreaterThan(0);
    const flat = { ...prepared, observations: prepared.observations.map((o) => ({ ...o, temperatureC: model.referenceTemperatureC })) };
    const without = solvePrepared(flat, model, UNCONTROLLED);
    expect(without.global.temperatureRaArcsecPerC).toBeNull();
    expect(without.global.temperatureDecArcsecPerC).toBeNull();
    expect(without.notes.some((n) => /held at its adopted value \(0\): temperature coefficients: the archive records no temperatures/.test(n))).toBe(true);
    expect(without.stars.every((s) => Number.isFinite(s.parallaxSigmaMas!))).toBe(true);
  });
});
