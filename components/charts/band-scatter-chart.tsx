"use client";

import { useMemo } from "react";
import { CartesianGrid, Legend, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import { formatQuantity } from "@/components/format";
import { bandSortKey } from "@/lib/views/chart-tooltip";
import { bandColour, bandMarker } from "@/lib/views/palette";
import { BandTooltip } from "./band-tooltip";

/** One plotted point: path distance in 1/Å, energy in eV. */
export interface BandScatterPoint {
  pathDistance: number;
  energy: number;
  band: number;
}

interface BandScatterChartProps {
  points: readonly BandScatterPoint[];
  /** Labelled k-points on the path-distance axis (1/Å). */
  ticks: readonly { label: string; pathDistance: number }[];
  /** Describes the chart for screen readers (what is plotted, how many points). */
  description: string;
  height?: number;
}

const tickKey = (x: number) => x.toFixed(6);

/**
 * Energy (eV) against path distance (1/Å), one colour per band (Okabe & Ito 2008; a new marker after
 * eight bands), labelled k-points as x-axis ticks with vertical guide lines. Data are points, never lines
 * (DESIGN.md "Look and feel").
 */
export function BandScatterChart({ points, ticks, description, height = 420 }: BandScatterChartProps) {
  const series = useMemo(() => {
    const byBand = new Map<number, BandScatterPoint[]>();
    for (const p of points) {
      const list = byBand.get(p.band);
      if (list) list.push(p);
      else byBand.set(p.band, [p]);
    }
    return [...byBand.entries()].sort(([a], [b]) => a - b);
  }, [points]);
  const tickLabels = useMemo(() => {
    const labels = new Map<string, string>();
    for (const t of ticks) {
      const key = tickKey(t.pathDistance);
      labels.set(key, labels.has(key) ? `${labels.get(key)}|${t.label}` : t.label);
    }
    return labels;
  }, [ticks]);
  const tickValues = useMemo(() => [...new Set(ticks.map((t) => t.pathDistance))], [ticks]);
  const labels = useMemo(() => new Map(series.map(([band]) => [`band-${band}`, `Band ${band}`])), [series]);

  return (
    <figure role="img" aria-label={description} className="w-full">
      <ResponsiveContainer width="100%" height={height}>
        <ScatterChart margin={{ top: 12, right: 24, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#e3e8ec" vertical={tickValues.length > 0} horizontal />
          <XAxis
            type="number"
            dataKey="pathDistance"
            domain={["dataMin", "dataMax"]}
            ticks={tickValues.length > 0 ? tickValues : undefined}
            tickFormatter={(x: number) => tickLabels.get(tickKey(x)) ?? x.toFixed(2)}
            label={{ value: tickValues.length > 0 ? "k-path (path distance, 1/Å)" : "Path distance (1/Å)", position: "insideBottom", offset: -16 }}
            tick={{ fontSize: 12 }}
          />
          <YAxis
            type="number"
            dataKey="energy"
            domain={["auto", "auto"]}
            tickFormatter={(e: number) => formatQuantity(e, { decimals: 1 })}
            label={{ value: "Energy (eV)", angle: -90, position: "insideLeft", offset: 4 }}
            tick={{ fontSize: 12 }}
          />
          <Tooltip cursor={false} content={(props) => <BandTooltip active={props.active} payload={props.payload} labels={labels} xKey="pathDistance" />} />
          <Legend verticalAlign="top" itemSorter={(item) => bandSortKey(String(item.value))} />
          {series.map(([band, list], i) => (
            <Scatter key={band} id={`band-${band}`} name={`Band ${band}`} data={list} fill={bandColour(i)} shape={bandMarker(i)} legendType={bandMarker(i)} isAnimationActive={false} />
          ))}
        </ScatterChart>
      </ResponsiveContainer>
    </figure>
  );
}
