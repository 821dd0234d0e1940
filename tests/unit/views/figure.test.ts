import { readFileSync } from "node:fs";
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { describe, expect, it } from "vitest";
import { type ChartFigureSource, type FigureInput, buildFigureSvg, chartFigure, figureFileName, figureSize } from "@/lib/views/figure";
import { crc32, pngPixelSize, withPhysicalResolution } from "@/lib/views/figure/png-resolution";
import { figureBandMarker, bandPalette } from "@/lib/views/palette";

const latinFont = readFileSync(new URL("../../../public/fonts/inter-latin-wght-normal.woff2", import.meta.url)).toString("base64");

// A honeycomb-like path Γ–M–K–Γ (path distances in 1/Å) with two bands, σ on the first.
const input: FigureInput = {
  kind: "overlay",
  width: "single",
  title: "HQ-07 graphene fit, revision 2: bands over the data",
  ticks: [
    { label: "Γ", position: 0 },
    { label: "M", position: 1.47 },
    { label: "K", position: 2.32 },
    { label: "Γ", position: 4.02 },
  ],
  xDomain: [0, 4.02],
  yDomain: [-9, 9],
  xTitle: "k along the path (1/Å)",
  yTitle: "E (eV)",
  dots: [
    { label: "band 1", colour: bandPalette[0].hex, marker: "circle", points: [{ x: 0, y: -8, sigma: 0.25 }, { x: 1, y: -5, sigma: 0.25 }] },
    { label: "band 2 & more", colour: bandPalette[1].hex, marker: "square", points: [{ x: 0, y: 8 }, { x: 1, y: 5 }] },
  ],
  lines: [{ colour: bandPalette[0].hex, points: [{ x: 0, y: -8.1 }, { x: 1, y: -5.1 }, { x: 1, y: null }, { x: 2, y: -2 }] }],
  lineLegend: [{ label: "model (revision 2)" }],
  fonts: [{ family: "Inter", woff2Base64: latinFont, unicodeRange: "U+0000-00FF" }],
};

const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "", textNodeName: "#text", isArray: (name) => ["text", "path"].includes(name) });

function parse(svg: string) {
  // XMLValidator.validate returns true or a description of the first well-formedness error.
  expect(XMLValidator.validate(svg)).toBe(true);
  return parser.parse(svg).svg as {
    width: string;
    height: string;
    viewBox: string;
    xmlns: string;
    text: ({ "#text"?: string | number } | string | number)[];
    title: string;
    defs: { style?: string };
    g: { path: { d: string; stroke?: string; fill?: string }[] };
  };
}

const texts = (svg: ReturnType<typeof parse>) => svg.text.map((t) => String(typeof t === "object" ? t["#text"] : t));

describe("figure sizes (APS: 8.6 cm one column, 17.8 cm two columns; 300 dpi)", () => {
  it("gives cm, points and pixels at 300 dpi", () => {
    // 8.6 cm / 2.54 × 72 = 243.78 pt; × 300 dpi / 2.54 = 1015.7 → 1016 px. 17.8 cm → 504.57 pt, 2102 px.
    expect(figureSize("overlay", "single")).toMatchObject({ widthCm: 8.6, widthPx: 1016 });
    expect(figureSize("overlay", "single").widthPt).toBeCloseTo(243.78, 2);
    expect(figureSize("residual", "double")).toMatchObject({ widthCm: 17.8, widthPx: 2102 });
    expect(figureSize("residual", "double").widthPt).toBeCloseTo(504.57, 2);
  });
});

describe("buildFigureSvg", () => {
  it("is well-formed SVG at the column width in cm with a viewBox in points", () => {
    const svg = parse(buildFigureSvg(input));
    expect(svg.xmlns).toBe("http://www.w3.org/2000/svg");
    expect(svg.width).toBe("8.6cm");
    expect(svg.height).toBe("6.5cm");
    const [minX, minY, w, h] = svg.viewBox.split(" ").map(Number);
    expect([minX, minY]).toEqual([0, 0]);
    expect(w).toBeCloseTo((8.6 / 2.54) * 72, 2);
    expect(h).toBeCloseTo((6.5 / 2.54) * 72, 2);
    expect(svg.title).toBe(input.title);
    const double = parse(buildFigureSvg({ ...input, width: "double" }));
    expect(double.width).toBe("17.8cm");
  });

  it("carries the k-path labels, the axis titles with units and the legend", () => {
    const labels = texts(parse(buildFigureSvg(input)));
    for (const expected of ["Γ", "M", "K", "k along the path (1/Å)", "E (eV)", "band 1", "band 2 & more", "model (revision 2)"]) expect(labels).toContain(expected);
    expect(labels.filter((t) => t === "Γ")).toHaveLength(2);
    // energy ticks every 5 eV (about six intervals over 18 eV), with true minus signs
    expect(labels).toEqual(expect.arrayContaining(["\u22125", "0", "5"]));
  });

  it("embeds the font as a base64 WOFF2 @font-face", () => {
    const svg = parse(buildFigureSvg(input));
    expect(svg.defs.style).toContain(`@font-face{font-family:"Inter";src:url(data:font/woff2;base64,${latinFont.slice(0, 40)}`);
    expect(svg.defs.style).toContain("unicode-range:U+0000-00FF");
  });

  it("draws ±σ error bars for points with σ and breaks lines at path jumps", () => {
    const paths = parse(buildFigureSvg(input)).g.path;
    const bars = paths.find((p) => p.stroke === bandPalette[0].hex && p.fill === "none" && !p.d.includes("L"));
    // two points with σ = 0.25 eV → two vertical segments, each 0.5 eV long on an 18 eV axis
    expect(bars?.d.match(/M/g)).toHaveLength(2);
    const line = paths.find((p) => p.d.includes("L") && p.fill === "none");
    expect(line?.d.match(/M/g)).toHaveLength(2);
  });

  it("refuses an empty domain", () => {
    expect(() => buildFigureSvg({ ...input, yDomain: [1, 1] })).toThrow(/increasing/);
  });
});

describe("figure markers for greyscale printing", () => {
  /** Relative luminance (WCAG 2.2 definition): what a greyscale print keeps of a colour. */
  const luminance = (hex: string) => {
    const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
    return 0.2126 * r + 0.7152 * g + 0.0722 * b;
  };
  it("tells any two of the first 40 bands apart by marker or by colour", () => {
    const looks = new Set(Array.from({ length: 40 }, (_, i) => `${bandPalette[i % 8].hex} ${figureBandMarker(i)}`));
    expect(looks.size).toBe(40);
  });
  it("gives two of the first ten bands the same marker only where their grey levels differ by > 0.1", () => {
    for (let i = 0; i < 10; i++)
      for (let j = i + 1; j < 10; j++)
        if (figureBandMarker(i) === figureBandMarker(j)) expect(Math.abs(luminance(bandPalette[i % 8].hex) - luminance(bandPalette[j % 8].hex))).toBeGreaterThan(0.1);
  });
});

describe("figure file names", () => {
  it("name the fit, revision, chart and width", () => {
    expect(figureFileName("HQ-07 Graphene ä fit", 2, "overlay", "single", "svg")).toBe("hq-07-graphene-a-fit-r2-bands-single-column.svg");
    expect(figureFileName("???", 1, "residual", "double", "png")).toBe("fit-r1-residuals-double-column.png");
  });
});

describe("PNG resolution chunk (PNG specification, W3C 3rd ed.)", () => {
  // Every PNG ends with the IEND chunk 00 00 00 00 49 45 4E 44 AE 42 60 82: its CRC-32 is 0xAE426082.
  it("computes the specification's CRC-32", () => {
    expect(crc32(new TextEncoder().encode("IEND"))).toBe(0xae426082);
  });

  it("adds pHYs at 300 dpi after IHDR and keeps the pixel size", () => {
    const ihdr = new Uint8Array([0, 0, 0, 13, 73, 72, 68, 82, 0, 0, 0x03, 0xf8, 0, 0, 0x02, 0xff, 8, 2, 0, 0, 0, 0, 0, 0, 0]);
    new DataView(ihdr.buffer).setUint32(21, crc32(ihdr.subarray(4, 21)));
    const iend = new Uint8Array([0, 0, 0, 0, 73, 69, 78, 68, 0xae, 0x42, 0x60, 0x82]);
    const png = new Uint8Array([137, 80, 78, 71, 13, 10, 26, 10, ...ihdr, ...iend]);
    expect(pngPixelSize(png)).toEqual({ width: 1016, height: 767 });
    const stamped = withPhysicalResolution(png, 300);
    expect(pngPixelSize(stamped)).toEqual({ width: 1016, height: 767 });
    const view = new DataView(stamped.buffer);
    expect(new TextDecoder().decode(stamped.subarray(37, 41))).toBe("pHYs");
    // 300 dpi = 300 / 0.0254 m = 11 811 pixels per metre
    expect(view.getUint32(41)).toBe(11811);
    expect(view.getUint32(45)).toBe(11811);
    expect(stamped[49]).toBe(1);
    expect(view.getUint32(50)).toBe(crc32(stamped.subarray(37, 50)));
    expect(() => pngPixelSize(new Uint8Array(40))).toThrow(/not a PNG/);
  });
});

describe("chartFigure", () => {
  const source: ChartFigureSource = {
    datasetName: "HQ-07 monolayer",
    ticks: input.ticks,
    xDomain: [0, 4.02],
    energyDomain: [-9, 9],
    bands: [{ band: 2, index: 1, colour: bandPalette[1].hex, points: [{ x: 0, y: 8 }] }],
    lines: input.lines,
    models: [{ label: "revision 2" }],
    residuals: [
      { band: 1, x: 0, y: 0.5 },
      { band: 2, x: 0, y: -0.03 },
      { band: 2, x: 1, y: 0.02 },
    ],
  };

  it("makes the overlay figure of the bands shown, with the zoom shown and one legend entry per model", () => {
    const figure = chartFigure(source, "overlay", "double");
    expect(figure).toMatchObject({ kind: "overlay", width: "double", yDomain: [-9, 9], yTitle: "E (eV)", lineLegend: [{ label: "model (revision 2)" }] });
    expect(figure.dots).toEqual([{ label: "band 2", colour: bandPalette[1].hex, marker: figureBandMarker(1), points: [{ x: 0, y: 8 }] }]);
  });

  it("makes the residual figure of the shown bands only, symmetric about a zero line", () => {
    const figure = chartFigure(source, "residual", "single");
    expect(figure.zeroLine).toBe(true);
    expect(figure.yTitle).toBe("model − data (eV)");
    // band 1 is hidden: its 0.5 eV residual neither shows nor widens the axis (|r| ≤ 0.03 eV → ±0.04 eV)
    expect(figure.dots[0].points).toHaveLength(2);
    expect(figure.yDomain[0]).toBeCloseTo(-0.04, 12);
    expect(figure.yDomain[1]).toBeCloseTo(0.04, 12);
    expect(() => parse(buildFigureSvg({ ...figure, fonts: [] }))).not.toThrow();
  });
});
