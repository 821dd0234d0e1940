"use client";

import { CartesianGrid, ComposedChart, ErrorBar, Line, ReferenceArea, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis, ZAxis } from "recharts";
import { BandTooltip } from "@/components/charts/band-tooltip";
import { MarkerIcon } from "@/components/charts/marker-icon";
import type { ChartPoint, PathTick } from "@/lib/views";
import { linearTicks } from "@/lib/views/band-series";
import type { BandMarker } from "@/lib/views/palette";
import { tickLabeller } from "@/lib/views/ticks";

/** Data points of one band, drawn as dots (with ±σ error bars where the points carry σ). */
export interface PointSeries {
  key: string;
  label: string;
  colour: string;
  marker: BandMarker;
  points: ChartPoint[];
}

/** A model band, drawn as a line (y null breaks it at a path jump). */
export interface LineSeries {
  key: string;
  label: string;
  colour: string;
  points: { x: number; y: number | null }[];
  /** SVG stroke-dasharray; undefined draws a solid line */
  dash?: string;
  /** thin lines for model bands no data band maps to */
  faint?: boolean;
}

interface BandChartProps {
  points: PointSeries[];
  lines: LineSeries[];
  ticks: PathTick[];
  /** energy axis range, eV */
  energyDomain: [number, number];
  /** a shaded energy window, eV (the fit's window on the preview) */
  window?: { min: number; max: number };
  /** y axis title; the default is the band energy */
  energyTitle?: string;
  /** what the chart shows, for screen readers (the figure's accessible name) */
  description: string;
  height?: number;
}

const AXIS_FONT = { fontSize: 12, fill: "#4b5563" };


/**
 * Energy against path distance: data as dots, model bands as lines, labelled high-symmetry ticks with
 * vertical grid lines at them. Zooming is the caller's `energyDomain`.
 */
export function BandChart({ points, lines, ticks, energyDomain, window, energyTitle = "E (eV)", description, height = 360 }: BandChartProps) {
  const tickPositions = ticks.map((t) => t.position);
  const labels = new Map([...points, ...lines].map((s) => [s.key, s.label]));
  const hasSigma = points.some((s) => s.points.some((p) => p.sigma !== undefined));
  const xDomain: [number, number] =
    tickPositions.length >= 2
      ? [tickPositions[0], tickPositions[tickPositions.length - 1]]
      : [Math.min(...points.flatMap((s) => s.points.map((p) => p.x)), 0), Math.max(...points.flatMap((s) => s.points.map((p) => p.x)), 1)];
  return (
    <figure role="img" aria-label={description} className="w-full">
      <ResponsiveContainer width="100%" height={height}>
        <ComposedChart margin={{ top: 8, right: 16, bottom: 24, left: 8 }}>
          <CartesianGrid stroke="#e5e7eb" vertical={false} />
          {tickPositions.map((x) => (
            <ReferenceArea key={`tick-${x}`} x1={x} x2={x} stroke="#9ca3af" strokeOpacity={0.6} ifOverflow="hidden" />
          ))}
          {window ? <ReferenceArea y1={window.min} y2={window.max} fill="#1c5264" fillOpacity={0.06} stroke="#1c5264" strokeOpacity={0.4} strokeDasharray="4 3" ifOverflow="hidden" /> : null}
          <XAxis
            type="number"
            dataKey="x"
            domain={xDomain}
            ticks={tickPositions.length ? tickPositions : undefined}
            tickFormatter={tickPositions.length ? tickLabeller(ticks) : (v: number) => v.toFixed(2)}
            tick={AXIS_FONT}
            allowDataOverflow
            label={{ value: "k along the path (1/Å)", position: "insideBottom", offset: -14, ...AXIS_FONT }}
          />
          <YAxis
            type="number"
            dataKey="y"
            domain={energyDomain}
            ticks={linearTicks(energyDomain)}
            allowDataOverflow
            tick={AXIS_FONT}
            tickFormatter={(v: number) => (Math.abs(v) < 1e-9 ? "0" : String(v).replace("-", "\u2212"))}
            label={{ value: energyTitle, angle: -90, position: "insideLeft", ...AXIS_FONT }}
            width={56}
          />
          {/* symbol area in px²: small dots, so that model lines stay visible where they lie on the data */}
          <ZAxis range={[28, 28]} />
          <Tooltip isAnimationActive={false} content={(props) => <BandTooltip active={props.active} payload={props.payload} labels={labels} />} />
          {points.map((series) => (
            <Scatter key={series.key} id={series.key} name={series.label} data={series.points} fill={series.colour} shape={series.marker} fillOpacity={0.7} isAnimationActive={false}>
              {series.points.some((p) => p.sigma !== undefined) ? (
                <ErrorBar dataKey="sigma" direction="y" width={0} stroke={series.colour} strokeWidth={1} isAnimationActive={false} />
              ) : null}
            </Scatter>
          ))}
          {lines.map((line) => (
            <Line
              key={line.key}
              id={line.key}
              name={line.label}
              data={line.points}
              dataKey="y"
              type="linear"
              stroke={line.colour}
              strokeWidth={line.faint ? 1 : 1.25}
              strokeOpacity={line.faint ? 0.6 : 1}
              strokeDasharray={line.dash}
              dot={false}
              activeDot={false}
              connectNulls={false}
              isAnimationActive={false}
            />
          ))}
        </ComposedChart>
      </ResponsiveContainer>
      <figcaption className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
        <span>Dots: data{hasSigma ? " with ±σ bars" : ""}. Lines: model (drawn over the dots).</span>
        {points.map((s) => (
          <span key={s.key} className="inline-flex items-center gap-1">
            <MarkerIcon marker={s.marker} colour={s.colour} />
            {s.label}
          </span>
        ))}
      </figcaption>
    </figure>
  );
}
