/** A Cartesian 3-vector; the unit depends on the use (au, au/day, or dimensionless for directions). */
export type Vec3 = readonly [number, number, number];

export function vec3(x: number, y: number, z: number): Vec3 {
  return [x, y, z];
}

export function add(a: Vec3, b: Vec3): Vec3 {
  return [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
}

export function subtract(a: Vec3, b: Vec3): Vec3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}

export function scale(a: Vec3, factor: number): Vec3 {
  return [a[0] * factor, a[1] * factor, a[2] * factor];
}

export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

export function cross(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

export function norm(a: Vec3): number {
  return Math.hypot(a[0], a[1], a[2]);
}

/** The unit vector along `a`; throws on the zero vector rather than returning NaNs. */
export function normalize(a: Vec3): Vec3 {
  const length = norm(a);
  if (length === 0) throw new RangeError('normalize: the zero vector has no direction');
  return [a[0] / length, a[1] / length, a[2] / length];
}

/** Unit vector from spherical angles (radians): longitude-like `alphaRad`, latitude-like `deltaRad`. */
export function fromSpherical(alphaRad: number, deltaRad: number): Vec3 {
  const cosDelta = Math.cos(deltaRad);
  return [cosDelta * Math.cos(alphaRad), cosDelta * Math.sin(alphaRad), Math.sin(deltaRad)];
}

/** Spherical angles of a vector: `alphaRad` in [0, 2π), `deltaRad` in [−π/2, π/2]. */
export function toSpherical(a: Vec3): { readonly alphaRad: number; readonly deltaRad: number } {
  const horizontal = Math.hypot(a[0], a[1]);
  const alpha = horizontal === 0 ? 0 : Math.atan2(a[1], a[0]);
  return {
    alphaRad: alpha < 0 ? alpha + 2 * Math.PI : alpha,
    deltaRad: Math.atan2(a[2], horizontal),
  };
}
