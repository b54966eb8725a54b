import { earthState, type EarthState } from '../astrometry/earth-state.ts';
import type { Mat3 } from '../math/mat3.ts';
import type { Vec3 } from '../math/vec3.ts';
import { equationOfEquinoxes06 } from '../earth/equation-of-equinoxes-06.ts';
import { nutation06a } from '../earth/nutation-series.ts';
import { biasPrecessionNutationMatrix06 } from '../earth/precession-06.ts';

/** Spacing of the nodes, days (3 h). */
export const SLOW_NODE_DAYS = 0.125;

/** The slowly varying part of the model at one instant: Earth's state, NPB matrix and equation of the equinoxes. */
export interface SlowSky {
  readonly earth: EarthState;
  readonly npb: Mat3;
  readonly equationOfEquinoxesRad: number;
}

/**
 * The slowly varying quantities (Earth's barycentric and heliocentric state from astronomy-engine,
 * the IAU 2006/2000A NPB matrix and equation of the equinoxes) evaluated on a 3-hour grid of TT
 * and interpolated by the three-point Lagrange formula about the nearest node. The fastest terms
 * (nutation's 5.6- and 13.7-day periods, the Moon's pull on Earth's velocity) then err by under
 * 1 µas and 0.01 m/s; what is interpolated is smooth, so this is the "compute the context once
 * per night" of the style guide without a loss of accuracy. Sidereal time is NOT interpolated.
 */
export class SlowSkyNodes {
  private readonly nodes = new Map<number, SlowSky>();

  at(ttDaysSinceJ2000: number): SlowSky {
    const k = Math.round(ttDaysSinceJ2000 / SLOW_NODE_DAYS);
    const u = ttDaysSinceJ2000 / SLOW_NODE_DAYS - k;
    const weights: Vec3 = [(u * (u - 1)) / 2, 1 - u * u, (u * (u + 1)) / 2];
    const nodes = [this.node(k - 1), this.node(k), this.node(k + 1)];
    const mix3 = (pick: (s: SlowSky) => Vec3): Vec3 => {
      const a = pick(nodes[0]), b = pick(nodes[1]), c = pick(nodes[2]);
      return [0, 1, 2].map((i) => weights[0] * a[i] + weights[1] * b[i] + weights[2] * c[i]) as unknown as Vec3;
    };
    const npb = nodes[1].npb.map((_, i) => weights[0] * nodes[0].npb[i] + weights[1] * nodes[1].npb[i] + weights[2] * nodes[2].npb[i]) as unknown as Mat3;
    return {
      earth: {
        barycentricPositionAu: mix3((s) => s.earth.barycentricPositionAu),
        barycentricVelocityAuPerDay: mix3((s) => s.earth.barycentricVelocityAuPerDay),
        heliocentricPositionAu: mix3((s) => s.earth.heliocentricPositionAu),
      },
      npb,
      equationOfEquinoxesRad: weights[0] * nodes[0].equationOfEquinoxesRad + weights[1] * nodes[1].equationOfEquinoxesRad + weights[2] * nodes[2].equationOfEquinoxesRad,
    };
  }

  private node(index: number): SlowSky {
    let value = this.nodes.get(index);
    if (value === undefined) {
      const tt = { jd1: 2_451_545, jd2: index * SLOW_NODE_DAYS };
      const nutation = nutation06a(tt);
      value = { earth: earthState(tt), npb: biasPrecessionNutationMatrix06(tt, nutation), equationOfEquinoxesRad: equationOfEquinoxes06(tt, nutation) };
      if (this.nodes.size > 96) this.nodes.clear();
      this.nodes.set(index, value);
    }
    return value;
  }
}
