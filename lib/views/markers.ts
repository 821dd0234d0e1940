import type { BandMarker } from "./palette";

const round = (v: number) => Number(v.toFixed(2));

/**
 * An SVG path (`d`) of a marker centred at (x, y) whose area is about that of a circle of radius r, so
 * no shape looks heavier than another. Shapes as recharts draws them: circle, square, triangle (point
 * up), diamond and cross (a plus sign).
 * @param marker - the shape
 * @param x - centre, user units
 * @param y - centre, user units
 * @param r - radius of the equal-area circle, user units (> 0)
 */
export function markerPath(marker: BandMarker, x: number, y: number, r: number): string {
  const p = (dx: number, dy: number) => `${round(x + dx)} ${round(y + dy)}`;
  switch (marker) {
    case "circle":
      return `M${p(-r, 0)}a${round(r)} ${round(r)} 0 1 0 ${round(2 * r)} 0a${round(r)} ${round(r)} 0 1 0 ${round(-2 * r)} 0Z`;
    case "square": {
      const h = (r * Math.sqrt(Math.PI)) / 2;
      return `M${p(-h, -h)}L${p(h, -h)}L${p(h, h)}L${p(-h, h)}Z`;
    }
    case "triangle": {
      // equilateral, side s with area (√3/4)s² = πr², centred on its centroid
      const s = r * Math.sqrt((4 * Math.PI) / Math.sqrt(3));
      const height = (s * Math.sqrt(3)) / 2;
      return `M${p(0, (-2 * height) / 3)}L${p(s / 2, height / 3)}L${p(-s / 2, height / 3)}Z`;
    }
    case "diamond": {
      // a square turned by 45°: half-diagonal d with area 2d² = πr²
      const d = r * Math.sqrt(Math.PI / 2);
      return `M${p(0, -d)}L${p(d, 0)}L${p(0, d)}L${p(-d, 0)}Z`;
    }
    case "cross": {
      // a plus of five unit squares of side u: area 5u² = πr²
      const u = r * Math.sqrt(Math.PI / 5);
      const a = u / 2;
      const b = (3 * u) / 2;
      return `M${p(-a, -b)}L${p(a, -b)}L${p(a, -a)}L${p(b, -a)}L${p(b, a)}L${p(a, a)}L${p(a, b)}L${p(-a, b)}L${p(-a, a)}L${p(-b, a)}L${p(-b, -a)}L${p(-a, -a)}Z`;
    }
  }
}
