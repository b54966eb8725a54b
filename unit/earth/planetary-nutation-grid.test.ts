import { describe, expect, it } from 'vitest';
import { nutation06a, nutation06aAtSteps } from '../../core/earth/nutation-series.ts';
import { PlanetaryNutationGrid } from '../../core/earth/planetary-nutation-grid.ts';
import { UAS } from '../../core/units.ts';

// The grid against the full planetary series of nutation06a (itself pinned to ERFA's nut06a in
// earth-orientation.test.ts): only the planetary part differs between the two calls.
describe('PlanetaryNutationGrid', () => {
  function worstOver(grid: PlanetaryNutationGrid, instants: number, seed: number): number {
    let a = seed;
    const next = () => ((a = (Math.imul(a, 1103515245) + 12345) >>> 0) / 4294967296);
    let worst = 0;
    for (let k = 0; k < instants; k++) {
      const tt = { jd1: 2_415_020.5 + Math.floor(next() * 73_050), jd2: next() };
      const exact = nutation06a(tt), fast = nutation06a(tt, grid);
      worst = Math.max(worst, Math.abs(fast.dpsiRad - exact.dpsiRad), Math.abs(fast.depsRad - exact.depsRad));
    }
    return worst;
  }

  it('gives Δψ and Δε within 1 µas of the full series at 8-day nodes over random instants 1900–2100', () => {
    const worst = worstOver(new PlanetaryNutationGrid(), 4000, 99);
    expect(worst / UAS).toBeLessThan(1);
    // Not trivially equal: the interpolation does leave a residual.
    expect(worst).toBeGreaterThan(0);
    console.log(`planetary nutation grid (8 d): worst ${(worst / UAS).toFixed(3)} µas over 4000 instants`);
  });

  it('gives them within 0.1 µas at 4-day nodes, and errs by more at 16-day nodes (the bound depends on the step)', () => {
    expect(worstOver(new PlanetaryNutationGrid(4), 2000, 7) / UAS).toBeLessThan(0.1);
    expect(worstOver(new PlanetaryNutationGrid(16), 2000, 7) / UAS).toBeGreaterThan(1);
  });

  it('serves nutation06aAtSteps through a night, consecutive nights sharing nodes', () => {
    const grid = new PlanetaryNutationGrid();
    const fast = new Float64Array(10), exact = new Float64Array(10);
    let worst = 0;
    for (let night = 0; night < 40; night++) {
      const centre = { jd1: 2_460_000.5 + night, jd2: 0 };
      nutation06aAtSteps(centre, 0.25, fast, grid);
      nutation06aAtSteps(centre, 0.25, exact);
      for (let k = 0; k < 10; k++) worst = Math.max(worst, Math.abs(fast[k] - exact[k]));
    }
    expect(worst / UAS).toBeLessThan(1);
  });

  it('refuses a step outside (0, 16] days, naming it', () => {
    expect(() => new PlanetaryNutationGrid(0)).toThrow(/stepDays must lie in \(0, 16\] \(got 0\)/);
    expect(() => new PlanetaryNutationGrid(40)).toThrow(/got 40/);
  });
});
