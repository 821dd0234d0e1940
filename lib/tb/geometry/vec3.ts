/** A 3-vector: Cartesian components (Å or 1/Å) or reduced coordinates, depending on context. */
export type Vec3 = [number, number, number];

export const dot = (a: Vec3, b: Vec3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];

export const cross = (a: Vec3, b: Vec3): Vec3 => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
];

export const add = (a: Vec3, b: Vec3): Vec3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];

export const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];

export const scale = (a: Vec3, s: number): Vec3 => [a[0] * s, a[1] * s, a[2] * s];

export const norm = (a: Vec3): number => Math.hypot(a[0], a[1], a[2]);

/** Σ_i c_i v_i: a linear combination of basis vectors with coefficients c. */
export function combine(coefficients: readonly number[], basis: readonly Vec3[]): Vec3 {
  const out: Vec3 = [0, 0, 0];
  coefficients.forEach((c, i) => {
    out[0] += c * basis[i][0];
    out[1] += c * basis[i][1];
    out[2] += c * basis[i][2];
  });
  return out;
}
