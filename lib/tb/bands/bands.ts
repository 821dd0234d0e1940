import {
  type EigenOutput,
  type GeneralisedEigenSolver,
  type HermitianEigenSolver,
  type SymmetricEigenSolver,
  createEigenOutput,
  createGeneralisedEigenSolver,
  createHermitianEigenSolver,
  createSymmetricEigenSolver,
} from "../../linalg";
import type { Vec3 } from "../geometry/vec3";
import { type PreparedHamiltonian, type PreparedMatrix, assembleMatrix, checkParameterVector, prepareHamiltonian } from "../hamiltonian/prepare";
import { type RealGauge, realGaugeOf } from "../hamiltonian/real-gauge";
import type { CompiledModel } from "../model/compile";

/** Options of {@link bandsWithGradients}. */
export interface BandGradientOptions {
  /** compute ∂E_n/∂θ_i; default true */
  gradients?: boolean;
  /** write energies here instead of allocating (length nk × nb) */
  energiesInto?: Float64Array;
  /** write gradients here instead of allocating (length nk × nb × np) */
  gradientsInto?: Float64Array;
  /**
   * only the gradients of bands [first, last] (0-based, inclusive, counted from the lowest band at each
   * k) are computed, the others are 0; default every band. A fit that compares data with some of the
   * bands needs only theirs, and skips their eigenvectors too.
   */
  gradientBands?: readonly [number, number];
}

export interface BandsWithGradients {
  /** nk × nb, row-major, eV, ascending at each k */
  energies: Float64Array;
  /** nk × nb × np: ∂E_n(k)/∂θ_i (eV per unit of θ_i), present when requested */
  gradients?: Float64Array;
}

interface Workspace {
  hRe: Float64Array;
  hIm: Float64Array;
  sRe: Float64Array;
  sIm: Float64Array;
  eigen: EigenOutput;
  standard: HermitianEigenSolver;
  generalised: GeneralisedEigenSolver;
  /** set when H(k) has a real gauge (see real-gauge.ts): H is then diagonalised as a real matrix */
  real: { gauge: RealGauge; solver: SymmetricEigenSolver; matrix: Float64Array; vectors: Float64Array } | null;
}

const workspaces = new WeakMap<PreparedHamiltonian, Workspace>();

function workspaceFor(prepared: PreparedHamiltonian): Workspace {
  let w = workspaces.get(prepared);
  if (!w) {
    const n = prepared.orbitalCount;
    w = {
      hRe: new Float64Array(n * n),
      hIm: new Float64Array(n * n),
      sRe: new Float64Array(n * n),
      sIm: new Float64Array(n * n),
      eigen: createEigenOutput(n),
      standard: createHermitianEigenSolver(n),
      generalised: createGeneralisedEigenSolver(n),
      real: realWorkspace(prepared),
    };
    workspaces.set(prepared, w);
  }
  return w;
}

function realWorkspace(prepared: PreparedHamiltonian): Workspace["real"] {
  const gauge = prepared.overlap ? null : realGaugeOf(prepared.compiled);
  const n = prepared.orbitalCount;
  return gauge
    ? { gauge, solver: createSymmetricEigenSolver(n), matrix: new Float64Array(n * n), vectors: new Float64Array(n * n) }
    : null;
}

/**
 * Assembles and diagonalises at one k-point into the workspace; eigenvectors (when asked for) of bands
 * `vectorBands` only.
 */
function solveAt(
  prepared: PreparedHamiltonian,
  w: Workspace,
  kIndex: number,
  theta: Float64Array,
  withVectors: boolean,
  vectorBands: readonly [number, number],
) {
  const n = prepared.orbitalCount;
  assembleMatrix(prepared.hamiltonian, kIndex, theta, w.hRe, w.hIm, false, n);
  if (prepared.overlap) {
    assembleMatrix(prepared.overlap, kIndex, theta, w.sRe, w.sIm, true, n);
    w.generalised.solve(w.hRe, w.hIm, w.sRe, w.sIm, w.eigen, withVectors);
  } else if (w.real) solveInRealGauge(w, w.real, n, withVectors, vectorBands);
  else w.standard.solve(w.hRe, w.hIm, w.eigen, withVectors, vectorBands);
}

/**
 * Diagonalises H̃ = U†HU = Re H + (Im H·P − P·Im H)/2 (real, lower triangle) and maps its eigenvectors φ
 * back: ψ = Uφ, ψ_j = ((1 + i)φ_j + (1 − i)π_j φ_P(j))/2.
 */
function solveInRealGauge(w: Workspace, real: NonNullable<Workspace["real"]>, n: number, withVectors: boolean, vectorBands: readonly [number, number]) {
  const { partner, parity } = real.gauge;
  const { hRe, hIm } = w;
  const a = real.matrix;
  for (let i = 0; i < n; i++) {
    const pi = partner[i] * n;
    for (let j = 0; j <= i; j++)
      a[i * n + j] = hRe[i * n + j] + 0.5 * (hIm[i * n + partner[j]] * parity[j] - parity[i] * hIm[pi + j]);
  }
  real.solver.solve(a, w.eigen.values, withVectors ? real.vectors : null, vectorBands);
  if (!withVectors) return;
  const phi = real.vectors;
  const yr = w.eigen.vectorsRe;
  const yi = w.eigen.vectorsIm;
  for (let m = vectorBands[0]; m <= vectorBands[1]; m++) {
    const row = m * n;
    for (let j = 0; j < n; j++) {
      const image = parity[j] * phi[row + partner[j]];
      yr[row + j] = 0.5 * (phi[row + j] + image);
      yi[row + j] = 0.5 * (phi[row + j] - image);
    }
  }
}

/** Adds scale × Re⟨ψ_n|∂M/∂θ_p|ψ_n⟩ into `gradients` for every band n and parameter p. */
function accumulateExpectation(
  matrix: PreparedMatrix,
  kIndex: number,
  eigen: EigenOutput,
  n: number,
  np: number,
  gradients: Float64Array,
  offset: number,
  energyWeighted: boolean,
  bands: readonly [number, number],
) {
  const { entry, parameter, coefficients, slotCount, upperSlots } = matrix;
  const base = kIndex * slotCount * 2;
  const vr = eigen.vectorsRe;
  const vi = eigen.vectorsIm;
  const count = upperSlots.length;
  for (let band = bands[0]; band <= bands[1]; band++) {
    const vb = band * n;
    const scale = energyWeighted ? -eigen.values[band] : 1;
    const out = offset + band * np;
    for (let u = 0; u < count; u++) {
      const s = upperSlots[u];
      const e = entry[s];
      const i = (e / n) | 0;
      const j = e - i * n;
      const cr = coefficients[base + 2 * s];
      const ci = coefficients[base + 2 * s + 1];
      const br = vr[vb + j];
      const bi = vi[vb + j];
      const x = cr * br - ci * bi;
      const y = cr * bi + ci * br;
      // Re(conj ψ_i c ψ_j); the mirror slot (j, i) holds conj(c) and adds the same amount.
      gradients[out + parameter[s]] += (i === j ? scale : 2 * scale) * (vr[vb + i] * x + vi[vb + i] * y);
    }
  }
}

/**
 * Band energies at every prepared k-point and, by the Hellmann–Feynman theorem, their derivatives
 * ∂E_n/∂θ_i = ⟨ψ_n|∂H/∂θ_i − E_n ∂S/∂θ_i|ψ_n⟩ with S-normalised ψ_n. Allocation-free per k-point; this
 * is what the fitting engine calls every iteration. At exact degeneracies the individual band
 * derivatives depend on the eigenvector choice within the degenerate space (their sum does not).
 * @param theta - parameter vector in `compiled.parameters` order
 */
export function bandsWithGradients(
  prepared: PreparedHamiltonian,
  theta: Float64Array,
  options: BandGradientOptions = {},
): BandsWithGradients {
  checkParameterVector(prepared.compiled, theta);
  const wantGradients = options.gradients ?? true;
  const n = prepared.orbitalCount;
  const np = prepared.parameterCount;
  const nk = prepared.kPoints.length;
  const energies = options.energiesInto ?? new Float64Array(nk * n);
  const gradients = wantGradients ? (options.gradientsInto ?? new Float64Array(nk * n * np)) : undefined;
  if (energies.length !== nk * n) throw new RangeError(`energiesInto must have length ${nk * n}`);
  if (gradients) {
    if (gradients.length !== nk * n * np) throw new RangeError(`gradientsInto must have length ${nk * n * np}`);
    gradients.fill(0);
  }
  const bands = options.gradientBands ?? [0, n - 1];
  if (!(Number.isInteger(bands[0]) && Number.isInteger(bands[1]) && bands[0] >= 0 && bands[0] <= bands[1] && bands[1] < n))
    throw new RangeError(`gradientBands must be 0-based [first, last] within 0…${n - 1}, got [${bands.join(", ")}]`);
  const w = workspaceFor(prepared);
  for (let k = 0; k < nk; k++) {
    solveAt(prepared, w, k, theta, wantGradients, bands);
    energies.set(w.eigen.values, k * n);
    if (!gradients) continue;
    const offset = k * n * np;
    accumulateExpectation(prepared.hamiltonian, k, w.eigen, n, np, gradients, offset, false, bands);
    if (prepared.overlap) accumulateExpectation(prepared.overlap, k, w.eigen, n, np, gradients, offset, true, bands);
  }
  return { energies, gradients };
}

/** Options of {@link computeBands}. */
export interface ComputeBandsOptions {
  /** also return eigenvectors; default false */
  eigenvectors?: boolean;
  /** also return orbital weights (Mulliken weights Re(c_i* (S c)_i), |c_i|² when S = I); default false */
  orbitalWeights?: boolean;
}

export interface ComputedBands {
  /** nk × nb, eV, ascending at each k */
  energies: Float64Array;
  /** nk × nb × nb: component i of band n at k is at (k·nb + n)·nb + i (S-normalised) */
  eigenvectorsRe?: Float64Array;
  eigenvectorsIm?: Float64Array;
  /** nk × nb × nb, same layout; each band's weights sum to 1 */
  orbitalWeights?: Float64Array;
}

/**
 * Bands for plots and export at any list of k-points.
 * @param theta - parameter vector (defaults to the document's values)
 * @param kPoints - Cartesian wave vectors, 1/Å
 */
export function computeBands(
  compiled: CompiledModel,
  theta: Float64Array | undefined,
  kPoints: readonly Vec3[],
  options: ComputeBandsOptions = {},
): ComputedBands {
  const values = theta ?? compiled.initialValues;
  checkParameterVector(compiled, values);
  const prepared = prepareHamiltonian(compiled, kPoints);
  const n = compiled.orbitalCount;
  const nk = kPoints.length;
  const withVectors = Boolean(options.eigenvectors || options.orbitalWeights);
  const energies = new Float64Array(nk * n);
  const re = options.eigenvectors ? new Float64Array(nk * n * n) : undefined;
  const im = options.eigenvectors ? new Float64Array(nk * n * n) : undefined;
  const weights = options.orbitalWeights ? new Float64Array(nk * n * n) : undefined;
  const w = workspaceFor(prepared);
  const allBands: [number, number] = [0, n - 1];
  for (let k = 0; k < nk; k++) {
    solveAt(prepared, w, k, values, withVectors, allBands);
    energies.set(w.eigen.values, k * n);
    re?.set(w.eigen.vectorsRe, k * n * n);
    im?.set(w.eigen.vectorsIm, k * n * n);
    if (weights) writeWeights(w, n, prepared.overlap !== null, weights, k * n * n);
  }
  return { energies, eigenvectorsRe: re, eigenvectorsIm: im, orbitalWeights: weights };
}

function writeWeights(w: Workspace, n: number, hasOverlap: boolean, into: Float64Array, offset: number) {
  const vr = w.eigen.vectorsRe;
  const vi = w.eigen.vectorsIm;
  for (let band = 0; band < n; band++) {
    const vb = band * n;
    for (let i = 0; i < n; i++) {
      if (!hasOverlap) {
        into[offset + vb + i] = vr[vb + i] ** 2 + vi[vb + i] ** 2;
        continue;
      }
      let sr = 0;
      let si = 0;
      for (let j = 0; j < n; j++) {
        sr += w.sRe[i * n + j] * vr[vb + j] - w.sIm[i * n + j] * vi[vb + j];
        si += w.sRe[i * n + j] * vi[vb + j] + w.sIm[i * n + j] * vr[vb + j];
      }
      into[offset + vb + i] = vr[vb + i] * sr + vi[vb + i] * si;
    }
  }
}
