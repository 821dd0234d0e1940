"use client";

import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { type TracePoint, convergenceSeries, formatLogTick, logAxisTicks } from "@/lib/views/convergence";

const AXIS_FONT = { fontSize: 12, fill: "#4b5563" };

/** χ² against iteration on a logarithmic axis with ticks at 1, 2, 5 × 10ⁿ (the best start's trace). */
export function ConvergenceChart({ trace }: { trace: TracePoint[] }) {
  const { points, domain } = convergenceSeries(trace);
  if (points.length === 0) return <p className="text-sm text-ink-muted">The fit recorded no iterations.</p>;
  const last = points[points.length - 1];
  return (
    <figure role="img" aria-label={`χ² fell from ${points[0].chiSquared.toPrecision(3)} to ${last.chiSquared.toPrecision(3)} in ${last.iteration} iterations`}>
      <ResponsiveContainer width="100%" height={220}>
        <LineChart data={points} margin={{ top: 8, right: 16, bottom: 24, left: 8 }}>
          <CartesianGrid stroke="#e5e7eb" />
          <XAxis type="number" dataKey="iteration" allowDecimals={false} tick={AXIS_FONT} label={{ value: "iteration", position: "insideBottom", offset: -14, ...AXIS_FONT }} />
          <YAxis
            type="number"
            dataKey="chiSquared"
            scale="log"
            domain={domain}
            ticks={logAxisTicks(domain)}
            interval={0}
            allowDataOverflow
            tick={AXIS_FONT}
            tickFormatter={formatLogTick}
            label={{ value: "χ² (log scale)", angle: -90, position: "insideLeft", ...AXIS_FONT }}
            width={64}
          />
          <Tooltip isAnimationActive={false} formatter={(v) => (typeof v === "number" ? v.toPrecision(5) : String(v))} labelFormatter={(l) => `iteration ${l}`} />
          <Line dataKey="chiSquared" name="χ²" stroke="#0072B2" strokeWidth={2} dot={{ r: 2 }} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}
