import type { ChartPoint } from "../band-series";
import { linearTicks } from "../band-series";
import { markerPath } from "../markers";
import type { BandMarker } from "../palette";
import type { PathTick } from "../ticks";
import { type FigureKind, type FigureWidth, figureSize } from "./figure-size";

/** Data points of one band: markers, with ±σ error bars where the points carry σ. */
export interface FigureDots {
  label: string;
  colour: string;
  marker: BandMarker;
  points: readonly ChartPoint[];
}

/** A model band as a line; y null breaks it (a jump in the path). */
export interface FigureLine {
  colour: string;
  /** stroke-dasharray in pt; undefined for solid */
  dash?: string;
  points: readonly { x: number; y: number | null }[];
}

/** A font embedded in the SVG as a base64 WOFF2 data URL (@font-face), so the figure looks the same anywhere. */
export interface FigureFont {
  family: string;
  woff2Base64: string;
  /** CSS unicode-range of this file (a subset) */
  unicodeRange?: string;
}

export interface FigureInput {
  kind: FigureKind;
  width: FigureWidth;
  /** accessible title of the SVG document */
  title: string;
  /** high-symmetry labels on the path axis; without them the axis gets numeric ticks */
  ticks: readonly PathTick[];
  /** path distance, 1/Å */
  xDomain: [number, number];
  /** eV */
  yDomain: [number, number];
  xTitle: string;
  yTitle: string;
  dots: readonly FigureDots[];
  lines: readonly FigureLine[];
  /** legend entries for the lines, e.g. "model (revision 2)", drawn as a short dark line */
  lineLegend: readonly { label: string; dash?: string }[];
  /** a horizontal line at y = 0 (the residual chart) */
  zeroLine?: boolean;
  fonts: readonly FigureFont[];
}

// Type sizes at print size, pt: 7–8 pt is what journals ask for in figures (common practice).
const TITLE_PT = 8;
const LABEL_PT = 7;
/** Mean advance of a character of Inter, in em: enough to lay out labels without measuring (from memory). */
const CHAR_EM = 0.56;
const INK = "#000000";
const GUIDE = "#9a9a9a";

const n = (v: number) => Number(v.toFixed(2)).toString();
const textWidth = (text: string, size: number) => [...text].length * size * CHAR_EM;

/** Escapes text and attribute values for XML. */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&apos;" })[c]!);
}

/** A tick value as printed: as many decimals as the step needs, a true minus sign. */
function tickText(value: number, step: number): string {
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const text = (Math.abs(value) < step * 1e-6 ? 0 : value).toFixed(decimals);
  return text.replace("-", "\u2212");
}

interface LegendEntry {
  label: string;
  draw: (x: number, y: number) => string;
}

/** Lays legend entries out in rows that fit `width`; returns each entry's position. */
function layoutLegend(entries: readonly LegendEntry[], width: number): { rows: number; placed: { entry: LegendEntry; x: number; row: number }[] } {
  const symbol = 10;
  const gap = 7;
  const placed: { entry: LegendEntry; x: number; row: number }[] = [];
  let x = 0;
  let row = 0;
  for (const entry of entries) {
    const w = symbol + 2 + textWidth(entry.label, LABEL_PT);
    if (x > 0 && x + w > width) {
      row += 1;
      x = 0;
    }
    placed.push({ entry, x, row });
    x += w + gap;
  }
  return { rows: entries.length ? row + 1 : 0, placed };
}

/**
 * A band figure as SVG text, at print size: width and height in cm, a viewBox in points (1 unit = 1 pt),
 * the k-path labels as x ticks with vertical guides, axis titles, a legend above the plot, data as
 * markers (distinct shapes, so bands stay apart in greyscale) with ±σ error bars, model bands as lines,
 * and the given fonts embedded. Pure: the same input gives the same bytes.
 */
export function buildFigureSvg(input: FigureInput): string {
  const size = figureSize(input.kind, input.width);
  const [x0, x1] = input.xDomain;
  const [y0, y1] = input.yDomain;
  if (!(x1 > x0) || !(y1 > y0)) throw new RangeError("a figure needs increasing x and y domains");

  const yTicks = linearTicks(input.yDomain);
  const yStep = yTicks.length > 1 ? yTicks[1] - yTicks[0] : y1 - y0;
  const yTickTexts = yTicks.map((v) => tickText(v, yStep));
  const numericX = input.ticks.length < 2;
  const xTicks = numericX ? linearTicks(input.xDomain).map((v, _, all) => ({ position: v, label: tickText(v, all.length > 1 ? all[1] - all[0] : 1) })) : input.ticks;

  const legendEntries: LegendEntry[] = [
    ...input.dots.map((d) => ({ label: d.label, draw: (x: number, y: number) => `<path d="${markerPath(d.marker, x + 5, y, 1.8)}" fill="${d.colour}"/>` })),
    ...input.lineLegend.map((l) => ({
      label: l.label,
      draw: (x: number, y: number) => `<path d="M${n(x)} ${n(y)}h10" stroke="${INK}" stroke-width="0.75" fill="none"${l.dash ? ` stroke-dasharray="${l.dash}"` : ""}/>`,
    })),
  ];

  const tickLength = 2.5;
  const left = 4 + TITLE_PT + 4 + Math.max(...yTickTexts.map((t) => textWidth(t, LABEL_PT))) + tickLength + 2;
  const right = 8;
  const plotWidth = size.widthPt - left - right;
  const legend = layoutLegend(legendEntries, plotWidth);
  const rowHeight = LABEL_PT + 3;
  const top = 5 + legend.rows * rowHeight + 2;
  const bottom = tickLength + 2 + LABEL_PT + 4 + TITLE_PT + 3;
  const plotHeight = size.heightPt - top - bottom;
  const sx = (x: number) => left + ((x - x0) / (x1 - x0)) * plotWidth;
  const sy = (y: number) => top + ((y1 - y) / (y1 - y0)) * plotHeight;
  const markerRadius = input.width === "single" ? 1.3 : 1.6;

  const out: string[] = [];
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${size.widthCm}cm" height="${size.heightCm}cm" viewBox="0 0 ${n(size.widthPt)} ${n(size.heightPt)}" font-family="${escapeXml(
      [...new Set(input.fonts.map((f) => f.family)), "Helvetica", "Arial", "sans-serif"].join(", "),
    )}" font-size="${LABEL_PT}">`,
  );
  out.push(`<title>${escapeXml(input.title)}</title>`);
  out.push("<defs>");
  if (input.fonts.length) {
    const faces = input.fonts.map(
      (f) =>
        `@font-face{font-family:"${f.family}";src:url(data:font/woff2;base64,${f.woff2Base64}) format("woff2");font-weight:100 900;font-style:normal${f.unicodeRange ? `;unicode-range:${f.unicodeRange}` : ""}}`,
    );
    out.push(`<style>${faces.join("")}</style>`);
  }
  out.push(`<clipPath id="plot-area"><rect x="${n(left)}" y="${n(top)}" width="${n(plotWidth)}" height="${n(plotHeight)}"/></clipPath>`);
  out.push("</defs>");
  out.push(`<rect width="100%" height="100%" fill="#ffffff"/>`);

  // legend, above the plot
  for (const { entry, x, row } of legend.placed) {
    const y = 5 + row * rowHeight + LABEL_PT / 2;
    out.push(entry.draw(left + x, y));
    out.push(`<text x="${n(left + x + 12)}" y="${n(y)}" dominant-baseline="central">${escapeXml(entry.label)}</text>`);
  }

  // guides at the high-symmetry points, the zero line, then data and model inside the plot area
  out.push(`<g clip-path="url(#plot-area)">`);
  if (!numericX) {
    for (const t of xTicks) out.push(`<path d="M${n(sx(t.position))} ${n(top)}V${n(top + plotHeight)}" stroke="${GUIDE}" stroke-width="0.4"/>`);
  }
  if (input.zeroLine && y0 < 0 && y1 > 0) out.push(`<path d="M${n(left)} ${n(sy(0))}H${n(left + plotWidth)}" stroke="${GUIDE}" stroke-width="0.5"/>`);
  for (const line of input.lines) {
    let d = "";
    let pen = false;
    for (const p of line.points) {
      if (p.y === null) {
        pen = false;
        continue;
      }
      d += `${pen ? "L" : "M"}${n(sx(p.x))} ${n(sy(p.y))}`;
      pen = true;
    }
    if (d) out.push(`<path d="${d}" fill="none" stroke="${line.colour}" stroke-width="0.75" stroke-linejoin="round"${line.dash ? ` stroke-dasharray="${line.dash}"` : ""}/>`);
  }
  for (const dots of input.dots) {
    const bars = dots.points
      .filter((p) => p.sigma !== undefined && p.sigma > 0)
      .map((p) => `M${n(sx(p.x))} ${n(sy(p.y - p.sigma!))}V${n(sy(p.y + p.sigma!))}`)
      .join("");
    if (bars) out.push(`<path d="${bars}" stroke="${dots.colour}" stroke-width="0.4" fill="none"/>`);
    const marks = dots.points.map((p) => markerPath(dots.marker, sx(p.x), sy(p.y), markerRadius)).join("");
    if (marks) out.push(`<path d="${marks}" fill="${dots.colour}"/>`);
  }
  out.push("</g>");

  // frame, ticks and tick labels
  out.push(`<rect x="${n(left)}" y="${n(top)}" width="${n(plotWidth)}" height="${n(plotHeight)}" fill="none" stroke="${INK}" stroke-width="0.6"/>`);
  const yTickPath = yTicks.map((v) => `M${n(left - tickLength)} ${n(sy(v))}h${tickLength}`).join("");
  out.push(`<path d="${yTickPath}" stroke="${INK}" stroke-width="0.5"/>`);
  yTicks.forEach((v, i) => out.push(`<text x="${n(left - tickLength - 1.5)}" y="${n(sy(v))}" text-anchor="end" dominant-baseline="central">${yTickTexts[i]}</text>`));
  const xTickPath = xTicks.map((t) => `M${n(sx(t.position))} ${n(top + plotHeight)}v${tickLength}`).join("");
  out.push(`<path d="${xTickPath}" stroke="${INK}" stroke-width="0.5"/>`);
  for (const t of xTicks) {
    out.push(`<text x="${n(sx(t.position))}" y="${n(top + plotHeight + tickLength + 1.5)}" text-anchor="middle" dominant-baseline="hanging">${escapeXml(t.label)}</text>`);
  }

  // axis titles with units
  out.push(`<text x="${n(left + plotWidth / 2)}" y="${n(size.heightPt - 3)}" text-anchor="middle" font-size="${TITLE_PT}">${escapeXml(input.xTitle)}</text>`);
  const yTitleX = 4 + TITLE_PT / 2;
  const yTitleY = top + plotHeight / 2;
  out.push(
    `<text x="${n(yTitleX)}" y="${n(yTitleY)}" transform="rotate(-90 ${n(yTitleX)} ${n(yTitleY)})" text-anchor="middle" dominant-baseline="central" font-size="${TITLE_PT}">${escapeXml(input.yTitle)}</text>`,
  );
  out.push("</svg>");
  return out.join("\n");
}
