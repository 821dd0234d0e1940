import type { FigureKind, FigureWidth } from "./figure-size";

/**
 * A figure's file name from the fit's name and revision, e.g. `hq-07-graphene-r2-bands-single-column.svg`:
 * lower case, runs of anything but letters and digits as one hyphen.
 */
export function figureFileName(fitName: string, revision: number, kind: FigureKind, width: FigureWidth, extension: "svg" | "png"): string {
  const stem = fitName
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60);
  return `${stem || "fit"}-r${revision}-${kind === "overlay" ? "bands" : "residuals"}-${width}-column.${extension}`;
}
