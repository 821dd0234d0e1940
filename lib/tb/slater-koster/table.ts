import type { Vec3 } from "../geometry/vec3";
import { type OrbitalName, SHELL_ORDER, angularMomentum, orbitalShell } from "../model/orbitals";
import type { BondType } from "./bond-types";

/** Bond-integral values by type (eV for hoppings, dimensionless for overlaps); unused types are ignored. */
export type BondIntegralValues = (bond: BondType) => number;

const SQRT3 = Math.sqrt(3);
const P_AXIS: Partial<Record<OrbitalName, number>> = { px: 0, py: 1, pz: 2 };
/** t2g orbitals as the pair of Cartesian axes they span (xy, yz, zx). */
const T2G_AXES: Partial<Record<OrbitalName, [number, number]>> = { dxy: [0, 1], dyz: [1, 2], dzx: [2, 0] };

/**
 * The Slater–Koster two-centre element E_a,b(l, m, n) = ⟨φ_a(r)|H|φ_b(r − d)⟩ for orbital a on the atom at
 * the origin and orbital b on the atom at d = |d|(l, m, n) (Slater & Koster, Phys. Rev. 94, 1498 (1954),
 * Table I; other entries by cyclic permutation, reversed order by E_b,a = (−1)^(l_a+l_b) E_a,b).
 * @param a - orbital on the first atom
 * @param b - orbital on the second atom
 * @param direction - unit vector (l, m, n) from the first atom to the second (dimensionless)
 * @param v - bond-integral values; for a pair of shells in descending order the integral of the ascending
 *   order is used (V(psσ) = V(spσ) of the reversed bond)
 */
export function slaterKosterElement(a: OrbitalName, b: OrbitalName, direction: Vec3, v: BondIntegralValues): number {
  if (SHELL_ORDER[orbitalShell(a)] > SHELL_ORDER[orbitalShell(b)]) {
    const sign = (angularMomentum(a) + angularMomentum(b)) % 2 === 0 ? 1 : -1;
    return sign * ascendingElement(b, a, direction, v);
  }
  return ascendingElement(a, b, direction, v);
}

function ascendingElement(a: OrbitalName, b: OrbitalName, c: Vec3, v: BondIntegralValues): number {
  const la = angularMomentum(a);
  const lb = angularMomentum(b);
  const sa = orbitalShell(a);
  if (la === 0 && lb === 0) {
    const bond = sa === "s" ? (b === "s" ? "ssσ" : "ss*σ") : "s*s*σ";
    return v(bond);
  }
  if (la === 0 && lb === 1) return c[P_AXIS[b]!] * v(sa === "s" ? "spσ" : "s*pσ");
  if (la === 0) return sdFactor(b, c) * v(sa === "s" ? "sdσ" : "s*dσ");
  if (la === 1 && lb === 1) {
    const i = P_AXIS[a]!;
    const j = P_AXIS[b]!;
    return c[i] * c[j] * (v("ppσ") - v("ppπ")) + (i === j ? v("ppπ") : 0);
  }
  if (la === 1) return pdElement(P_AXIS[a]!, b, c, v("pdσ"), v("pdπ"));
  return ddElement(a, b, c, v("ddσ"), v("ddπ"), v("ddδ"));
}

function sdFactor(d: OrbitalName, [l, m, n]: Vec3): number {
  switch (d) {
    case "dxy":
      return SQRT3 * l * m;
    case "dyz":
      return SQRT3 * m * n;
    case "dzx":
      return SQRT3 * n * l;
    case "dx2-y2":
      return (SQRT3 / 2) * (l * l - m * m);
    default:
      return n * n - (l * l + m * m) / 2;
  }
}

function pdElement(axis: number, d: OrbitalName, c: Vec3, sigma: number, pi: number): number {
  const [l, m, n] = c;
  const ca = c[axis];
  const t2g = T2G_AXES[d];
  if (t2g) {
    if (t2g[0] === axis || t2g[1] === axis) {
      const other = c[t2g[0] === axis ? t2g[1] : t2g[0]];
      return SQRT3 * ca * ca * other * sigma + other * (1 - 2 * ca * ca) * pi;
    }
    return SQRT3 * l * m * n * sigma - 2 * l * m * n * pi;
  }
  const l2m2 = l * l - m * m;
  if (d === "dx2-y2") {
    if (axis === 0) return (SQRT3 / 2) * l * l2m2 * sigma + l * (1 - l2m2) * pi;
    if (axis === 1) return (SQRT3 / 2) * m * l2m2 * sigma - m * (1 + l2m2) * pi;
    return (SQRT3 / 2) * n * l2m2 * sigma - n * l2m2 * pi;
  }
  const z2 = n * n - (l * l + m * m) / 2;
  if (axis === 2) return n * z2 * sigma + SQRT3 * n * (l * l + m * m) * pi;
  return ca * z2 * sigma - SQRT3 * ca * n * n * pi;
}

function ddElement(a: OrbitalName, b: OrbitalName, c: Vec3, sigma: number, pi: number, delta: number): number {
  const ta = T2G_AXES[a];
  const tb = T2G_AXES[b];
  if (ta && tb) return t2gPair(ta, tb, c, sigma, pi, delta);
  if (ta || tb) return t2gWithEg(ta ?? tb!, ta ? b : a, c, sigma, pi, delta);
  const [l, m, n] = c;
  const l2m2 = l * l - m * m;
  const lm2 = l * l + m * m;
  const z2 = n * n - lm2 / 2;
  if (a === "dx2-y2" && b === "dx2-y2")
    return 0.75 * l2m2 * l2m2 * sigma + (lm2 - l2m2 * l2m2) * pi + (n * n + (l2m2 * l2m2) / 4) * delta;
  if (a === "dz2" && b === "dz2") return z2 * z2 * sigma + 3 * n * n * lm2 * pi + 0.75 * lm2 * lm2 * delta;
  return SQRT3 * (0.5 * l2m2 * z2 * sigma - n * n * l2m2 * pi + 0.25 * (1 + n * n) * l2m2 * delta);
}

function t2gPair(ta: [number, number], tb: [number, number], c: Vec3, sigma: number, pi: number, delta: number) {
  if (ta[0] === tb[0] && ta[1] === tb[1]) {
    const x = c[ta[0]] ** 2;
    const y = c[ta[1]] ** 2;
    const third = c[3 - ta[0] - ta[1]] ** 2;
    return 3 * x * y * sigma + (x + y - 4 * x * y) * pi + (third + x * y) * delta;
  }
  const shared = ta.find((axis) => tb.includes(axis))!;
  const first = c[ta[0] === shared ? ta[1] : ta[0]];
  const second = c[tb[0] === shared ? tb[1] : tb[0]];
  const s2 = c[shared] ** 2;
  return 3 * first * s2 * second * sigma + first * second * (1 - 4 * s2) * pi + first * second * (s2 - 1) * delta;
}

function t2gWithEg(t2g: [number, number], eg: OrbitalName, c: Vec3, sigma: number, pi: number, delta: number) {
  const [l, m, n] = c;
  const l2m2 = l * l - m * m;
  const lm2 = l * l + m * m;
  const z2 = n * n - lm2 / 2;
  const key = `${t2g[0]}${t2g[1]}`; // "01" xy, "12" yz, "20" zx
  if (eg === "dx2-y2") {
    if (key === "01") return 1.5 * l * m * l2m2 * sigma + 2 * l * m * -l2m2 * pi + 0.5 * l * m * l2m2 * delta;
    if (key === "12") return 1.5 * m * n * l2m2 * sigma - m * n * (1 + 2 * l2m2) * pi + m * n * (1 + l2m2 / 2) * delta;
    return 1.5 * n * l * l2m2 * sigma + n * l * (1 - 2 * l2m2) * pi - n * l * (1 - l2m2 / 2) * delta;
  }
  if (key === "01") return SQRT3 * (l * m * z2 * sigma - 2 * l * m * n * n * pi + 0.5 * l * m * (1 + n * n) * delta);
  if (key === "12") return SQRT3 * (m * n * z2 * sigma + m * n * (lm2 - n * n) * pi - 0.5 * m * n * lm2 * delta);
  return SQRT3 * (l * n * z2 * sigma + l * n * (lm2 - n * n) * pi - 0.5 * l * n * lm2 * delta);
}
