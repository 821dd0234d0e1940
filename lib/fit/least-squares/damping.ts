/**
 * Damping control of Levenberg–Marquardt by the gain ratio ρ = actual / predicted reduction of χ²:
 * Nielsen's rule (H. B. Nielsen, "Damping parameter in Marquardt's method", IMM-REP-1999-05, DTU;
 * Madsen, Nielsen & Tingleff, "Methods for non-linear least squares problems", 2nd ed. 2004, §3.1;
 * the section number is from memory).
 * Accepted step: λ ← λ·max(1/3, 1 − (2ρ − 1)³), ν ← 2. Rejected step: λ ← λ·ν, ν ← 2ν.
 */
export interface DampingState {
  /** λ, added to the diagonal of the scaled JᵀJ. */
  damping: number;
  /** Growth factor applied on the next rejection. */
  growth: number;
}

/** Smallest λ kept, so the library's "damping must be positive" check always holds (common practice). */
const MIN_DAMPING = 1e-15;

/**
 * Initial λ = τ·max diag(JᵀJ) with τ = 1e-3 (Madsen, Nielsen & Tingleff 2004, §3.1, from memory).
 * @param maxDiagonal - largest diagonal entry of the scaled JᵀJ (dimensionless)
 */
export function initialDamping(maxDiagonal: number): DampingState {
  return { damping: Math.max(1e-3 * maxDiagonal, MIN_DAMPING), growth: 2 };
}

/**
 * Next damping after a step.
 * @param state - damping before the step
 * @param gainRatio - actual over predicted χ² reduction; ≤ 0 or NaN means the step was rejected
 */
export function updateDamping(state: DampingState, gainRatio: number): DampingState {
  if (gainRatio > 0) {
    const factor = Math.max(1 / 3, 1 - (2 * gainRatio - 1) ** 3);
    return { damping: Math.max(state.damping * factor, MIN_DAMPING), growth: 2 };
  }
  return { damping: state.damping * state.growth, growth: state.growth * 2 };
}
