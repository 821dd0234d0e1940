import {
  type EigenOutput,
  type GeneralisedEigenSolver,
  type HermitianEigenSolver,
  type SymmetricEigenSolver,
  createEigenOutput,
  createGeneralisedEigenSolver,
  createHermitianEigenSolver,
  createSymmetricEigenSolver,
  clusterDerivatives,
  nearDegenerateClusters,
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
  /**
   * eV; bands closer than this to a neighbour at a k-point form a near-degenerate cluster, whose bands get
   * the two-sided degenerate-subspace derivative instead of their own Hellmann–Feynman value (see
   * {@link bandsWithGradients}). Default 0: every band keeps its own.
   */
  crossingTolerance?: number;
  /**
   * nk × nb flags written when given: 1 for a band (within `gradientBands`) in a cluster whose derivative is
   * not unique — an accidental crossing, where some parameter moves the cluster's bands apart — else 0.
   */
  crossingsInto?: Uint8Array;
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
 * ∂E_n/∂θ_i = ⟨ψ_n|∂H/∂θ_i − E_n ∂S/∂θ_i|ψ_n⟩ with S-normalised ψ_n. Allocation-free per k-point away
 * from crossings; this is what the fitting engine calls every iteration.
 *
 * Where sorted bands meet (closer than `crossingTolerance`), a band's own derivative is not defined and
 * the Hellmann–Feynman value depends on which eigenvectors the solver returns. There, for each parameter
 * alone, the cluster's bands get the two-sided derivative of degenerate perturbation theory
 * (`clusterDerivatives` in lib/linalg: (μ_i + μ_{d+1−i})/2 from the eigenvalues μ of ∂H/∂θ_i − Ē ∂S/∂θ_i
 * projected onto the cluster, Ē its mean energy) — what central differences along that parameter give.
 * A step along several parameters at once moves a crossing's bands non-linearly; the Jacobian stays the
 * column-wise derivative. The cluster's summed derivative (the trace) is the same either way.
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
  const tolerance = options.crossingTolerance ?? 0;
  const flags = options.crossingsInto;
  if (flags) {
    if (flags.length !== nk * n) throw new RangeError(`crossingsInto must have length ${nk * n}`);
    flags.fill(0);
  }
  const w = workspaceFor(prepared);
  for (let k = 0; k < nk; k++) {
    solveAt(prepared, w, k, theta, wantGradients, bands);
    energies.set(w.eigen.values, k * n);
    if (!gradients) continue;
    const clusters = tolerance > 0 ? nearDegenerateClusters(w.eigen.values, tolerance).filter(([a, b]) => b >= bands[0] && a <= bands[1]) : [];
    // a cluster reaching past the requested bands needs its other members' eigenvectors too
    if (clusters.length > 0 && (clusters[0][0] < bands[0] || clusters[clusters.length - 1][1] > bands[1]))
      solveAt(prepared, w, k, theta, true, [Math.min(bands[0], clusters[0][0]), Math.max(bands[1], clusters[clusters.length - 1][1])]);
    const offset = k * n * np;
    accumulateExpectation(prepared.hamiltonian, k, w.eigen, n, np, gradients, offset, false, bands);
    if (prepared.overlap) accumulateExpectation(prepared.overlap, k, w.eigen, n, np, gradients, offset, true, bands);
    for (const cluster of clusters) {
      const accidental = applyClusterDerivatives(prepared, k, w.eigen, cluster, gradients, offset, bands);
      if (flags && accidental) for (let b = Math.max(cluster[0], bands[0]); b <= Math.min(cluster[1], bands[1]); b++) flags[k * n + b] = 1;
    }
  }
  return { energies, gradients };
}

// A cluster whose projected derivative has a spread above this (relative to its size, at least 1) is a
// true crossing; below, the spread is rounding of a degeneracy by symmetry (common practice).
const CROSSING_SPREAD = 1e-9;

/**
 * Replaces the gradients of one near-degenerate cluster's bands (those within `bands`) by the two-sided
 * degenerate-subspace derivative, parameter by parameter. Returns whether some parameter moves the
 * cluster's bands apart (an accidental crossing rather than a degeneracy by symmetry).
 */
function applyClusterDerivatives(
  prepared: PreparedHamiltonian,
  kIndex: number,
  eigen: EigenOutput,
  [first, last]: readonly [number, number],
  gradients: Float64Array,
  offset: number,
  bands: readonly [number, number],
): boolean {
  const n = prepared.orbitalCount;
  const np = prepared.parameterCount;
  const d = last - first + 1;
  let mean = 0;
  for (let b = first; b <= last; b++) mean += eigen.values[b] / d;
  const re = Array.from({ length: np }, () => new Float64Array(d * d));
  const im = Array.from({ length: np }, () => new Float64Array(d * d));
  projectCluster(prepared.hamiltonian, kIndex, eigen, n, first, d, 1, re, im);
  if (prepared.overlap) projectCluster(prepared.overlap, kIndex, eigen, n, first, d, -mean, re, im);
  let accidental = false;
  for (let p = 0; p < np; p++) {
    const { twoSided, spread, increase } = clusterDerivatives(re[p], im[p], d);
    const size = Math.max(1, Math.abs(increase[0]), Math.abs(increase[d - 1]));
    if (spread > CROSSING_SPREAD * size) accidental = true;
    for (let b = Math.max(first, bands[0]); b <= Math.min(last, bands[1]); b++) gradients[offset + b * np + p] = twoSided[b - first];
  }
  return accidental;
}

/** Adds scale × ⟨ψ_a|∂M/∂θ_p|ψ_b⟩ for the cluster's bands a, b (0-based within it) into each parameter's d × d matrix. */
function projectCluster(
  matrix: PreparedMatrix,
  kIndex: number,
  eigen: EigenOutput,
  n: number,
  first: number,
  d: number,
  scale: number,
  re: Float64Array[],
  im: Float64Array[],
) {
  const { entry, parameter, coefficients, slotCount, upperSlots } = matrix;
  const base = kIndex * slotCount * 2;
  const vr = eigen.vectorsRe;
  const vi = eigen.vectorsIm;
  for (const s of upperSlots) {
    const i = (entry[s] / n) | 0;
    const j = entry[s] - i * n;
    const cr = scale * coefficients[base + 2 * s];
    const ci = scale * coefficients[base + 2 * s + 1];
    const pr = re[parameter[s]];
    const pi = im[parameter[s]];
    for (let a = 0; a < d; a++) {
      const va = (first + a) * n;
      for (let b = 0; b < d; b++) {
        const vb = (first + b) * n;
        // conj(ψ_a,i) c ψ_b,j
        let x = cr * vr[vb + j] - ci * vi[vb + j];
        let y = cr * vi[vb + j] + ci * vr[vb + j];
        let sumRe = vr[va + i] * x + vi[va + i] * y;
        let sumIm = vr[va + i] * y - vi[va + i] * x;
        if (i !== j) {
          // the mirror slot (j, i) holds conj(c): conj(ψ_a,j) conj(c) ψ_b,i
          x = cr * vr[vb + i] + ci * vi[vb + i];
          y = cr * vi[vb + i] - ci * vr[vb + i];
          sumRe += vr[va + j] * x + vi[va + j] * y;
          sumIm += vr[va + j] * y - vi[va + j] * x;
        }
        pr[a * d + b] += sumRe;
        pi[a * d + b] += sumIm;
      }
    }
  }
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
