"use client";

import { useState } from "react";
import { Button, Notice, Select } from "@/components/ui";
import {
  type ChartFigureSource,
  FIGURE_DPI,
  type FigureFont,
  type FigureKind,
  type FigureWidth,
  buildFigureSvg,
  chartFigure,
  figureFileName,
  figureSize,
  withPhysicalResolution,
} from "@/lib/views/figure";

/** The app's Inter subsets (public/fonts), embedded in every figure; unicode ranges as @fontsource ships them. */
const fontFiles = [
  {
    url: "/fonts/inter-latin-wght-normal.woff2",
    unicodeRange: "U+0000-00FF,U+0131,U+0152-0153,U+02BB-02BC,U+02C6,U+02DA,U+02DC,U+0304,U+0308,U+0329,U+2000-206F,U+20AC,U+2122,U+2191,U+2193,U+2212,U+2215,U+FEFF,U+FFFD",
  },
  { url: "/fonts/inter-greek-wght-normal.woff2", unicodeRange: "U+0370-0377,U+037A-037F,U+0384-038A,U+038C,U+038E-03A1,U+03A3-03FF" },
];

let fontsLoaded: Promise<FigureFont[]> | null = null;

function base64(bytes: Uint8Array): string {
  let text = "";
  for (let i = 0; i < bytes.length; i += 0x8000) text += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(text);
}

/** Fetches the fonts once per page. */
function loadFonts(): Promise<FigureFont[]> {
  fontsLoaded ??= Promise.all(
    fontFiles.map(async (file) => {
      const response = await fetch(file.url);
      if (!response.ok) throw new Error(`the figure font ${file.url} did not load (${response.status})`);
      return { family: "Inter", woff2Base64: base64(new Uint8Array(await response.arrayBuffer())), unicodeRange: file.unicodeRange };
    }),
  ).catch((error: unknown) => {
    fontsLoaded = null;
    throw error;
  });
  return fontsLoaded;
}

function save(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement("a");
  link.href = url;
  link.download = fileName;
  link.click();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Draws the SVG on a canvas at 300 dpi (width_cm / 2.54 × 300 pixels) and encodes it as PNG with its resolution. */
async function rasterise(svg: string, kind: FigureKind, width: FigureWidth): Promise<Blob> {
  const { widthPx, heightPx } = figureSize(kind, width);
  const url = URL.createObjectURL(new Blob([svg], { type: "image/svg+xml" }));
  try {
    const image = new Image(widthPx, heightPx);
    image.src = url;
    await image.decode();
    const canvas = document.createElement("canvas");
    canvas.width = widthPx;
    canvas.height = heightPx;
    const context = canvas.getContext("2d");
    if (!context) throw new Error("this browser cannot draw the figure");
    context.drawImage(image, 0, 0, widthPx, heightPx);
    const png = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/png"));
    if (!png) throw new Error("this browser could not encode the figure as PNG");
    return new Blob([withPhysicalResolution(new Uint8Array(await png.arrayBuffer()), FIGURE_DPI) as BlobPart], { type: "image/png" });
  } finally {
    URL.revokeObjectURL(url);
  }
}

/**
 * Downloads the shown chart (the bands shown and the zoom as on screen) as a figure for a paper: SVG or PNG
 * at 300 dpi, one column (8.6 cm) or two (17.8 cm) wide, with the fonts embedded.
 */
export function FigureDownloads({ source, fitName, revision }: { source: ChartFigureSource; fitName: string; revision: number }) {
  const [kind, setKind] = useState<FigureKind>("overlay");
  const [width, setWidth] = useState<FigureWidth>("single");
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function download(format: "svg" | "png") {
    setBusy(true);
    setProblem(null);
    try {
      const svg = buildFigureSvg({ ...chartFigure(source, kind, width), fonts: await loadFonts() });
      const blob = format === "svg" ? new Blob([svg], { type: "image/svg+xml" }) : await rasterise(svg, kind, width);
      save(blob, figureFileName(fitName, revision, kind, width, format));
    } catch (error) {
      setProblem(error instanceof Error ? error.message : "The figure could not be made.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col text-sm" htmlFor="figure-kind">
          Figure
          <Select id="figure-kind" density="compact" value={kind} onChange={(e) => setKind(e.target.value === "residual" ? "residual" : "overlay")}>
            <option value="overlay">bands over the data</option>
            <option value="residual">residuals along the path</option>
          </Select>
        </label>
        <label className="flex flex-col text-sm" htmlFor="figure-width">
          Width
          <Select id="figure-width" density="compact" value={width} onChange={(e) => setWidth(e.target.value === "double" ? "double" : "single")}>
            <option value="single">single column, 8.6 cm</option>
            <option value="double">double column, 17.8 cm</option>
          </Select>
        </label>
        <Button size="sm" variant="secondary" onClick={() => download("svg")} disabled={busy}>
          Figure (SVG)
        </Button>
        <Button size="sm" variant="secondary" onClick={() => download("png")} disabled={busy}>
          Figure (PNG, 300 dpi)
        </Button>
      </div>
      <p className="text-xs text-ink-muted">The bands shown and the zoom above; fonts embedded; markers differ per band so that a greyscale print keeps them apart.</p>
      {problem ? <Notice tone="error">{problem}</Notice> : null}
    </div>
  );
}
