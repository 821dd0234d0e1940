import { type PreparedHamiltonian, bandsWithGradients } from "@/lib/tb";
import type { LeastSquaresProblem, ParameterSpec, ValuesWithJacobian } from "../least-squares";
import type { KeptPoint } from "./points";
import { type EnergyAlignment, alignEnergy, alignmentDerivatives } from "./energy-alignment";
import type { BandMapping } from "./schema";

/** Where the global parameters sit in θ: after the model's own parameters. */
export interface GlobalParameterSlots {
  offset: number;
  renormalisation: number;
  /** E_ref of the renormalisation, eV */
  reference: number;
}

/** Predicted energies at one θ, with the model band each point was compared with (0-based). */
export interface Prediction {
  values: Float64Array;
  modelBands: Int32Array;
}

/**
 * The band fit as a least-squares problem. θ = [model parameters…, δ, Z]; for point p at k-point g
 *   f_p(θ) = E_m(p)(k_g) aligned by δ, Z and E_ref (energy-alignment.ts: E_ref + (E − E_ref)/Z + δ),
 * with m(p) fixed by the offset mapping, or, for the nearest mapping, the band among the candidates
 * whose f is closest to the data energy at the θ being evaluated.
 *
 * Jacobian: ∂f_p/∂θ_i = (∂f/∂E)·∂E_m/∂θ_i with ∂E_m/∂θ_i from Hellmann–Feynman (`bandsWithGradients`:
 * one diagonalisation per distinct k-point per evaluation, shared by every point at that k), and ∂f_p/∂δ,
 * ∂f_p/∂Z from `alignmentDerivatives`. For the nearest mapping the assignment m(p) is held fixed while
 * differentiating: the objective is piecewise smooth and this is its derivative wherever the assignment
 * does not switch (finite differences agree there). At an accidental crossing of model bands the band's
 * derivative is the two-sided degenerate-subspace one (`crossingTolerance`, see `bandsWithGradients`).
 */
export class BandResidualModel {
  private readonly modelParameterCount: number;
  private readonly bandCount: number;
  private readonly energies: Float64Array;
  private readonly gradients: Float64Array;
  private readonly values: Float64Array;
  private readonly jacobian: Float64Array;
  private readonly candidates: [number, number];
  /** Model bands any point can be compared with (0-based, inclusive): the only ones needing gradients. */
  private readonly usedBands: [number, number];

  constructor(
    private readonly hamiltonian: PreparedHamiltonian,
    private readonly points: readonly KeptPoint[],
    private readonly slots: GlobalParameterSlots,
    mapping: BandMapping,
    /** eV: bands closer than this get the degenerate-subspace derivative (0: off) */
    private readonly crossingTolerance: number,
  ) {
    this.modelParameterCount = hamiltonian.parameterCount;
    this.bandCount = hamiltonian.orbitalCount;
    const nk = hamiltonian.kPoints.length;
    this.energies = new Float64Array(nk * this.bandCount);
    this.gradients = new Float64Array(nk * this.bandCount * this.modelParameterCount);
    // The engine copies (whitens) values and Jacobians on receipt, so these buffers are reused.
    this.values = new Float64Array(points.length);
    this.jacobian = new Float64Array(points.length * (this.modelParameterCount + 2));
    const range = mapping.kind === "nearest" ? (mapping.modelBands ?? [1, this.bandCount]) : [1, this.bandCount];
    this.candidates = [range[0] - 1, range[1] - 1];
    this.usedBands = usedBandRange(points, this.candidates);
  }

  /** The problem for the least-squares engine. */
  problem(parameters: ParameterSpec[]): LeastSquaresProblem {
    return {
      parameters,
      observed: this.points.map((p) => p.energy),
      sigma: this.points.map((p) => p.sigma),
      evaluate: (theta) => this.predict(theta).values,
      evaluateWithJacobian: (theta) => this.valuesWithJacobian(theta),
    };
  }

  /** Predicted energies (eV) and the model band of every point at θ. */
  predict(theta: Float64Array): Prediction {
    this.solve(theta, false);
    const modelBands = new Int32Array(this.points.length);
    this.fill(theta, modelBands);
    return { values: this.values, modelBands };
  }

  private valuesWithJacobian(theta: Float64Array): ValuesWithJacobian {
    this.solve(theta, true);
    const modelBands = new Int32Array(this.points.length);
    this.fill(theta, modelBands);
    const np = this.modelParameterCount;
    const width = np + 2;
    const alignment = this.alignmentAt(theta);
    const { gradients, energies, jacobian, bandCount } = this;
    this.points.forEach((point, i) => {
      const band = modelBands[i];
      const source = (point.kIndex * bandCount + band) * np;
      const row = i * width;
      const d = alignmentDerivatives(energies[point.kIndex * bandCount + band], alignment);
      for (let j = 0; j < np; j++) jacobian[row + j] = gradients[source + j] * d.energy;
      jacobian[row + this.slots.offset] = d.offset;
      jacobian[row + this.slots.renormalisation] = d.renormalisation;
    });
    return { values: this.values, jacobian };
  }

  /**
   * How many points sit at an accidental crossing at θ: their model band within the crossing tolerance of
   * another band, which some parameter moves apart (the flags of `bandsWithGradients`).
   */
  crossingPoints(theta: Float64Array): number {
    const flags = new Uint8Array(this.energies.length);
    this.solve(theta, true, flags);
    const modelBands = new Int32Array(this.points.length);
    this.fill(theta, modelBands);
    return this.points.filter((point, i) => flags[point.kIndex * this.bandCount + modelBands[i]] === 1).length;
  }

  private solve(theta: Float64Array, withGradients: boolean, crossingsInto?: Uint8Array): void {
    bandsWithGradients(this.hamiltonian, theta.subarray(0, this.modelParameterCount), {
      gradients: withGradients,
      energiesInto: this.energies,
      gradientsInto: withGradients ? this.gradients : undefined,
      gradientBands: this.usedBands,
      crossingTolerance: this.crossingTolerance,
      crossingsInto,
    });
  }

  private alignmentAt(theta: Float64Array): EnergyAlignment {
    return { offset: theta[this.slots.offset], renormalisation: theta[this.slots.renormalisation], reference: this.slots.reference };
  }

  private fill(theta: Float64Array, modelBands: Int32Array): void {
    const alignment = this.alignmentAt(theta);
    const { energies, values, bandCount } = this;
    const [low, high] = this.candidates;
    this.points.forEach((point, i) => {
      const base = point.kIndex * bandCount;
      let band = point.modelBand;
      if (band < 0) {
        band = low;
        let best = Infinity;
        for (let m = low; m <= high; m++) {
          const distance = Math.abs(alignEnergy(energies[base + m], alignment) - point.energy);
          if (distance < best) {
            best = distance;
            band = m;
          }
        }
      }
      modelBands[i] = band;
      values[i] = alignEnergy(energies[base + band], alignment);
    });
  }
}

/** The lowest and highest model band (0-based) any point is compared with; nearest-mapped points may use every candidate. */
function usedBandRange(points: readonly KeptPoint[], candidates: [number, number]): [number, number] {
  let low = Infinity;
  let high = -Infinity;
  for (const { modelBand } of points) {
    const [from, to] = modelBand < 0 ? candidates : [modelBand, modelBand];
    low = Math.min(low, from);
    high = Math.max(high, to);
  }
  return [low, high];
}
