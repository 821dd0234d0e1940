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

/** Above this many decades a log axis keeps only the powers of ten, or its 1, 2, 5 ticks would crowd. */
const MAX_DECADES_WITH_SUBTICKS = 3;

/**
 * Ticks of a logarithmic axis at 1, 2 and 5 × 10ⁿ inside the domain (the usual round steps, common
 * practice), or at 10ⁿ alone when the domain spans more than three decades.
 * @param domain - [low, high], both > 0
 */
export function logAxisTicks([low, high]: [number, number]): number[] {
  if (!(low > 0 && high > low)) throw new RangeError(`a log axis needs 0 < low < high, got [${low}, ${high}]`);
  const first = Math.floor(Math.log10(low));
  const last = Math.ceil(Math.log10(high));
  const mantissas = last - first > MAX_DECADES_WITH_SUBTICKS ? [1] : [1, 2, 5];
  const ticks: number[] = [];
  for (let n = first; n <= last; n++) {
    for (const m of mantissas) {
      // m × 10ⁿ through a decimal string, so 2 × 10⁻³ is exactly the double nearest 0.002
      const value = Number(`${m}e${n}`);
      if (value >= low * (1 - 1e-12) && value <= high * (1 + 1e-12)) ticks.push(value);
    }
  }
  return ticks;
}

const superscripts: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };

/**
 * A log-axis tick as text: plain decimals from 0.01 to 1000 ("0.05", "200"), else m×10ⁿ with a
 * superscript exponent ("2×10⁻⁵", "10⁶").
 * @param value - a tick from {@link logAxisTicks}
 */
export function formatLogTick(value: number): string {
  if (value >= 0.01 && value <= 1000) return String(Number(value.toPrecision(6)));
  const exponent = Math.floor(Math.log10(value) + 1e-9);
  const mantissa = Number((value / 10 ** exponent).toPrecision(6));
  const power = `10${String(exponent).split("").map((c) => superscripts[c]).join("")}`;
  return mantissa === 1 ? power : `${mantissa}×${power}`;
}
