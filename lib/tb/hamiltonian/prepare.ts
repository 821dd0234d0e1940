import { type ComplexMatrix, createComplexMatrix } from "../../linalg";
import type { Vec3 } from "../geometry/vec3";
import type { CompiledModel, ModelMatrix } from "../model/compile";
import { ModelError } from "../model/errors";

/**
 * The k-dependent coefficients of one matrix (H or S) for a batch of k-points. Because the matrix is
 * linear in θ, M(k; θ) = Σ_slots θ_parameter[slot] × coefficient(k, slot) at element entry[slot], where a
 * slot is one (matrix element, parameter) pair with all its Bloch phases summed.
 */
export interface PreparedMatrix {
  /** row-major element index i × n + j of each slot */
  readonly entry: Int32Array;
  /** parameter index of each slot */
  readonly parameter: Int32Array;
  /** per k-point, per slot: re, im interleaved (length nk × slots × 2) */
  readonly coefficients: Float64Array;
  readonly slotCount: number;
  /**
   * Slots on or above the diagonal (i ≤ j). A slot below the diagonal holds the complex conjugate of its
   * mirror slot, so expectation values ⟨ψ|∂M/∂θ|ψ⟩ need only these, off-diagonal ones counted twice.
   */
  readonly upperSlots: Int32Array;
}

/** H (and S) coefficients for a fixed list of k-points, ready for fast assembly at any θ. */
export interface PreparedHamiltonian {
  readonly compiled: CompiledModel;
  /** Cartesian k-points, 1/Å */
  readonly kPoints: readonly Vec3[];
  readonly orbitalCount: number;
  readonly parameterCount: number;
  readonly hamiltonian: PreparedMatrix;
  /** null for an orthogonal model (S = I) */
  readonly overlap: PreparedMatrix | null;
}

/**
 * Precomputes, for every k-point, the coefficient of every parameter in every element of H(k) (and S(k)):
 * H_ij(k) = Σ_terms θ_p f e^{ik·(R + τ_j − τ_i)}.
 * @param compiled - a compiled model
 * @param kPoints - Cartesian wave vectors, 1/Å (2π included)
 */
export function prepareHamiltonian(compiled: CompiledModel, kPoints: readonly Vec3[]): PreparedHamiltonian {
  return {
    compiled,
    kPoints,
    orbitalCount: compiled.orbitalCount,
    parameterCount: compiled.parameters.length,
    hamiltonian: prepareMatrix(compiled, kPoints, "hamiltonian"),
    overlap: compiled.hasOverlap ? prepareMatrix(compiled, kPoints, "overlap") : null,
  };
}

function prepareMatrix(compiled: CompiledModel, kPoints: readonly Vec3[], matrix: ModelMatrix): PreparedMatrix {
  const n = compiled.orbitalCount;
  const terms = compiled.terms.filter((t) => t.matrix === matrix);
  const slotOf = new Map<string, number>();
  const entries: number[] = [];
  const parameters: number[] = [];
  const termSlot = terms.map((t) => {
    const entry = t.from * n + t.to;
    const key = `${entry}|${t.parameter}`;
    let slot = slotOf.get(key);
    if (slot === undefined) {
      slot = entries.length;
      slotOf.set(key, slot);
      entries.push(entry);
      parameters.push(t.parameter);
    }
    return slot;
  });
  // Many terms share a bond vector (all orbital pairs of one bond): evaluate each phase once per k.
  const bondOf = new Map<string, number>();
  const bonds: Vec3[] = [];
  const termBond = terms.map((t) => {
    const key = t.bond.join(",");
    let index = bondOf.get(key);
    if (index === undefined) {
      index = bonds.length;
      bondOf.set(key, index);
      bonds.push(t.bond);
    }
    return index;
  });
  const slotCount = entries.length;
  const coefficients = new Float64Array(kPoints.length * slotCount * 2);
  const cos = new Float64Array(bonds.length);
  const sin = new Float64Array(bonds.length);
  for (let ki = 0; ki < kPoints.length; ki++) {
    const k = kPoints[ki];
    for (let b = 0; b < bonds.length; b++) {
      const phase = k[0] * bonds[b][0] + k[1] * bonds[b][1] + k[2] * bonds[b][2];
      cos[b] = Math.cos(phase);
      sin[b] = Math.sin(phase);
    }
    const base = ki * slotCount * 2;
    for (let ti = 0; ti < terms.length; ti++) {
      const t = terms[ti];
      const c = cos[termBond[ti]];
      const s = sin[termBond[ti]];
      const at = base + termSlot[ti] * 2;
      coefficients[at] += t.re * c - t.im * s;
      coefficients[at + 1] += t.re * s + t.im * c;
    }
  }
  const upperSlots = Int32Array.from(entries.map((e, slot) => ({ e, slot })).filter(({ e }) => Math.floor(e / n) <= e % n).map(({ slot }) => slot));
  return { entry: Int32Array.from(entries), parameter: Int32Array.from(parameters), coefficients, slotCount, upperSlots };
}

/**
 * Writes M(k; θ) for k-point `kIndex` into row-major `re` / `im` (overwritten). For the overlap the
 * identity (orthonormal orbitals on one site) is added.
 * @param theta - parameter vector in `compiled.parameters` order (eV / dimensionless)
 */
export function assembleMatrix(
  prepared: PreparedMatrix,
  kIndex: number,
  theta: Float64Array,
  re: Float64Array,
  im: Float64Array,
  addIdentity: boolean,
  size: number,
): void {
  re.fill(0);
  im.fill(0);
  if (addIdentity) for (let i = 0; i < size; i++) re[i * size + i] = 1;
  const { entry, parameter, coefficients, slotCount } = prepared;
  const base = kIndex * slotCount * 2;
  for (let s = 0; s < slotCount; s++) {
    const value = theta[parameter[s]];
    const e = entry[s];
    re[e] += value * coefficients[base + 2 * s];
    im[e] += value * coefficients[base + 2 * s + 1];
  }
}

/** Throws a ModelError unless θ has one finite value per parameter. */
export function checkParameterVector(compiled: CompiledModel, theta: ArrayLike<number>): void {
  if (theta.length !== compiled.parameters.length)
    throw new ModelError([
      { path: "theta", message: `expected ${compiled.parameters.length} parameter values, got ${theta.length}` },
    ]);
  for (let i = 0; i < theta.length; i++)
    if (!Number.isFinite(theta[i]))
      throw new ModelError([{ path: `theta.${i}`, message: `parameter "${compiled.parameters[i].name}" is not finite` }]);
}

/**
 * H(k; θ) as a complex matrix (eV), for tests and tooling; use {@link prepareHamiltonian} in loops.
 * @param theta - parameter vector in `compiled.parameters` order
 * @param k - Cartesian wave vector, 1/Å
 */
export function hamiltonianAt(compiled: CompiledModel, theta: ArrayLike<number>, k: Vec3): ComplexMatrix {
  return matrixAt(compiled, theta, k, "hamiltonian");
}

/**
 * S(k; θ) as a complex matrix (dimensionless; the identity for an orthogonal model).
 * @param k - Cartesian wave vector, 1/Å
 */
export function overlapAt(compiled: CompiledModel, theta: ArrayLike<number>, k: Vec3): ComplexMatrix {
  return matrixAt(compiled, theta, k, "overlap");
}

/**
 * ∂H/∂θ_p at k (eV per unit of θ_p); H is linear in θ, so this is H(k) at the unit vector e_p.
 * For an overlap parameter it is zero; use {@link overlapDerivativeAt}.
 * @param k - Cartesian wave vector, 1/Å
 */
export function hamiltonianDerivativeAt(compiled: CompiledModel, parameter: number, k: Vec3): ComplexMatrix {
  const unit = new Float64Array(compiled.parameters.length);
  unit[parameter] = 1;
  const prepared = prepareMatrix(compiled, [k], "hamiltonian");
  const m = createComplexMatrix(compiled.orbitalCount);
  assembleMatrix(prepared, 0, unit, m.re, m.im, false, compiled.orbitalCount);
  return m;
}

/** ∂S/∂θ_p at k (Cartesian 1/Å). */
export function overlapDerivativeAt(compiled: CompiledModel, parameter: number, k: Vec3): ComplexMatrix {
  const unit = new Float64Array(compiled.parameters.length);
  unit[parameter] = 1;
  const prepared = prepareMatrix(compiled, [k], "overlap");
  const m = createComplexMatrix(compiled.orbitalCount);
  assembleMatrix(prepared, 0, unit, m.re, m.im, false, compiled.orbitalCount);
  return m;
}

function matrixAt(compiled: CompiledModel, theta: ArrayLike<number>, k: Vec3, matrix: ModelMatrix): ComplexMatrix {
  checkParameterVector(compiled, theta);
  const prepared = prepareMatrix(compiled, [k], matrix);
  const m = createComplexMatrix(compiled.orbitalCount);
  assembleMatrix(prepared, 0, Float64Array.from(theta), m.re, m.im, matrix === "overlap", compiled.orbitalCount);
  return m;
}

/**
 * Writes H(k_kIndex; θ) (eV) into `into` without allocating: the fitting loop's assembly step.
 * @param theta - parameter vector in `compiled.parameters` order
 */
export function assembleHamiltonian(prepared: PreparedHamiltonian, kIndex: number, theta: Float64Array, into: ComplexMatrix): void {
  assembleMatrix(prepared.hamiltonian, kIndex, theta, into.re, into.im, false, prepared.orbitalCount);
}

/** Writes S(k_kIndex; θ) (dimensionless; the identity for an orthogonal model) into `into` without allocating. */
export function assembleOverlap(prepared: PreparedHamiltonian, kIndex: number, theta: Float64Array, into: ComplexMatrix): void {
  const n = prepared.orbitalCount;
  if (prepared.overlap) assembleMatrix(prepared.overlap, kIndex, theta, into.re, into.im, true, n);
  else {
    into.re.fill(0);
    into.im.fill(0);
    for (let i = 0; i < n; i++) into.re[i * n + i] = 1;
  }
}
