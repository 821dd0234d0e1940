/** A point of the convergence trace for a log-scaled chart. */
export interface TracePoint {
  iteration: number;
  chiSquared: number;
}

/**
 * The convergence trace ready for a logarithmic χ² axis: points with χ² ≤ 0 cannot be drawn on a log
 * scale and are left out (a perfect fit reaches χ² = 0 only in exact arithmetic), and the axis domain
 * spans whole decades around the data.
 * @param trace - χ² (dimensionless) per iteration, from the fit result
 */
export function convergenceSeries(trace: readonly TracePoint[]): { points: TracePoint[]; domain: [number, number] } {
  const points = trace.filter((p) => p.chiSquared > 0 && Number.isFinite(p.chiSquared)).map(({ iteration, chiSquared }) => ({ iteration, chiSquared }));
  if (points.length === 0) return { points, domain: [1e-3, 1] };
  const logs = points.map((p) => Math.log10(p.chiSquared));
  const low = Math.floor(Math.min(...logs));
  const high = Math.ceil(Math.max(...logs));
  return { points, domain: [10 ** low, 10 ** (high === low ? low + 1 : high)] };
}
