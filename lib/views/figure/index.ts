export { FIGURE_DPI, type FigureKind, type FigureSize, type FigureWidth, figureSize, figureWidthsCm } from "./figure-size";
export { type FigureDots, type FigureFont, type FigureInput, type FigureLine, buildFigureSvg, escapeXml } from "./svg-figure";
export { figureFileName } from "./figure-file";
export { crc32, pngPixelSize, withPhysicalResolution } from "./png-resolution";
export { type ChartFigureSource, chartFigure } from "./chart-figure";
