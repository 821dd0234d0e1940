/** A fitted parameter as the comparison needs it (value and standard error in the parameter's unit). */
export interface ComparedParameter {
  name: string;
  unit: string;
  value: number;
  /** null when fixed or not determined */
  standardError: number | null;
  free: boolean;
}

/** One row of the parameter comparison of two revisions. */
export interface ParameterComparisonRow {
  name: string;
  unit: string;
  /** absent when the revision's model has no such parameter */
  a: ComparedParameter | null;
  b: ComparedParameter | null;
  /** b − a, in the unit; null when one side lacks the parameter */
  difference: number | null;
  /** √(σ_a² + σ_b²), with a missing σ (fixed parameter) counted as 0; null when neither side has one */
  combinedError: number | null;
  /** |b − a| > √(σ_a² + σ_b²); null when there is no error to compare with */
  differsBeyondErrors: boolean | null;
}

/**
 * Parameters of two revisions side by side, in a's order then b's extra ones.
 * The rule: two independent estimates differ when |Δ| exceeds their combined standard error
 * √(σ_a² + σ_b²) — the quadrature sum of independent errors (Taylor, "An Introduction to Error
 * Analysis", 2nd ed. 1997, ch. 3, errors of a difference; common practice for a 1σ comparison).
 * Revisions of one fit share data, so the estimates are not strictly independent; the rule is a guide.
 */
export function compareParameters(a: readonly ComparedParameter[], b: readonly ComparedParameter[]): ParameterComparisonRow[] {
  const byNameB = new Map(b.map((p) => [p.name, p]));
  const names = [...a.map((p) => p.name), ...b.filter((p) => !a.some((q) => q.name === p.name)).map((p) => p.name)];
  const byNameA = new Map(a.map((p) => [p.name, p]));
  return names.map((name) => {
    const pa = byNameA.get(name) ?? null;
    const pb = byNameB.get(name) ?? null;
    const difference = pa && pb ? pb.value - pa.value : null;
    const errors = [pa?.standardError, pb?.standardError].filter((e): e is number => typeof e === "number");
    const combinedError = pa && pb && errors.length > 0 ? Math.hypot(...errors) : null;
    const differsBeyondErrors = difference !== null && combinedError !== null ? Math.abs(difference) > combinedError : null;
    return { name, unit: (pa ?? pb)!.unit, a: pa, b: pb, difference, combinedError, differsBeyondErrors };
  });
}

/** Per-band statistics as the comparison needs them (eV). */
export interface ComparedBand {
  dataBand: number;
  points: number;
  rms: number;
}

/** One row of the per-band RMS comparison. */
export interface BandComparisonRow {
  dataBand: number;
  rmsA: number | null;
  rmsB: number | null;
  /** rmsB − rmsA, eV; negative means b fits this band better */
  change: number | null;
}

/** RMS per data band of two revisions side by side, bands ascending. */
export function compareBands(a: readonly ComparedBand[], b: readonly ComparedBand[]): BandComparisonRow[] {
  const bands = [...new Set([...a, ...b].map((x) => x.dataBand))].sort((x, y) => x - y);
  return bands.map((dataBand) => {
    const rmsA = a.find((x) => x.dataBand === dataBand)?.rms ?? null;
    const rmsB = b.find((x) => x.dataBand === dataBand)?.rms ?? null;
    return { dataBand, rmsA, rmsB, change: rmsA !== null && rmsB !== null ? rmsB - rmsA : null };
  });
}
