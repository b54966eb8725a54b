import type { Vec3 } from '../math/vec3.ts';
import { DEG } from '../units.ts';

/**
 * Keplerian elements of the giant planets, J2000 mean ecliptic and equinox, valid 1800–2050:
 * E. M. Standish, "Keplerian Elements for Approximate Positions of the Major Planets" (JPL Solar
 * System Dynamics, Table 1; values from memory, checked against astronomy-engine in
 * unit/astrometry/sun-barycentric-offset.test.ts). Per planet: a (au), e, I, L, ϖ, Ω (degrees) and
 * their rates per Julian century, then the planet's mass (with satellites) over the Sun's
 * (IAU 2009 system: Jupiter 1/1047.3486, Saturn 1/3497.898, Uranus 1/22902.98, Neptune 1/19412.24).
 */
const PLANETS: readonly (readonly number[])[] = [
  [5.202887, 0.04838624, 1.30439695, 34.39644051, 14.72847983, 100.47390909,
    -0.00011607, -0.00013253, -0.00183714, 3034.74612775, 0.21252668, 0.20469106, 1 / 1047.3486],
  [9.53667594, 0.05386179, 2.48599187, 49.95424423, 92.59887831, 113.66242448,
    -0.0012506, -0.00050991, 0.00193609, 1222.49362201, -0.41897216, -0.28867794, 1 / 3497.898],
  [19.18916464, 0.04725744, 0.77263783, 313.23810451, 170.9542763, 74.01692503,
    -0.00196176, -0.00004397, -0.00242939, 428.48202785, 0.40805281, 0.04240589, 1 / 22902.98],
  [30.06992276, 0.00859048, 1.77004347, -55.12002969, 44.96476227, 131.78422574,
    0.00026291, 0.00005105, 0.00035372, 218.45945325, -0.32241464, -0.00508664, 1 / 19412.24],
];
const OBLIQUITY_J2000_RAD = 84381.406 * (DEG / 3600);

/**
 * The Sun's position (au) and velocity (au/day) relative to the solar-system barycentre, J2000
 * equatorial axes, from the four giant planets on Keplerian orbits: r☉ = −Σ μᵢ rᵢ / (1 + Σ μᵢ).
 * Like astronomy-engine's barycentre, it leaves out the terrestrial planets (Venus and the
 * Earth–Moon pair move the Sun by ~0.1 m/s each, 2e-6 au). Against astronomy-engine's barycentric
 * Sun over 1900–2100: 0.035 m/s and 2.5e-5 au (asserted < 0.25 m/s, 3e-5 au in the test), i.e.
 * < 0.03 mas of aberration; 30× cheaper than its BaryState. `daysSinceJ2000` is TDB (TT will do).
 */
export function sunBarycentricState(daysSinceJ2000: number): { readonly positionAu: Vec3; readonly velocityAuPerDay: Vec3 } {
  const t = daysSinceJ2000 / 36525;
  const position = [0, 0, 0];
  const velocity = [0, 0, 0];
  let massSum = 0;
  for (const p of PLANETS) {
    const mu = p[12];
    const state = keplerState(p, t);
    for (let i = 0; i < 3; i++) {
      position[i] -= mu * state[i];
      velocity[i] -= mu * state[3 + i];
    }
    massSum += mu;
  }
  const cos = Math.cos(OBLIQUITY_J2000_RAD), sin = Math.sin(OBLIQUITY_J2000_RAD);
  const equatorial = (v: number[]): Vec3 => [v[0] / (1 + massSum), (cos * v[1] - sin * v[2]) / (1 + massSum), (sin * v[1] + cos * v[2]) / (1 + massSum)];
  return { positionAu: equatorial(position), velocityAuPerDay: equatorial(velocity) };
}

/** Heliocentric ecliptic position (au) and velocity (au/day) of one planet at `t` centuries. */
function keplerState(p: readonly number[], t: number): number[] {
  const a = p[0] + p[6] * t, e = p[1] + p[7] * t, inclination = (p[2] + p[8] * t) * DEG;
  const meanLongitude = (p[3] + p[9] * t) * DEG, perihelion = (p[4] + p[10] * t) * DEG, node = (p[5] + p[11] * t) * DEG;
  const meanMotionPerDay = (p[9] * DEG) / 36525;
  const meanAnomaly = meanLongitude - perihelion;
  let eccentric = meanAnomaly + e * Math.sin(meanAnomaly);
  for (let k = 0; k < 6; k++) eccentric -= (eccentric - e * Math.sin(eccentric) - meanAnomaly) / (1 - e * Math.cos(eccentric));
  const cosE = Math.cos(eccentric), sinE = Math.sin(eccentric);
  const root = Math.sqrt(1 - e * e);
  const rate = meanMotionPerDay / (1 - e * cosE);
  const x = a * (cosE - e), y = a * root * sinE;
  const vx = -a * sinE * rate, vy = a * root * cosE * rate;
  const w = perihelion - node;
  const cw = Math.cos(w), sw = Math.sin(w), cn = Math.cos(node), sn = Math.sin(node), ci = Math.cos(inclination), si = Math.sin(inclination);
  const r11 = cw * cn - sw * sn * ci, r12 = -sw * cn - cw * sn * ci;
  const r21 = cw * sn + sw * cn * ci, r22 = -sw * sn + cw * cn * ci;
  const r31 = sw * si, r32 = cw * si;
  return [r11 * x + r12 * y, r21 * x + r22 * y, r31 * x + r32 * y, r11 * vx + r12 * vy, r21 * vx + r22 * vy, r31 * vx + r32 * vy];
}
