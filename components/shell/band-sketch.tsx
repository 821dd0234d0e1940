import { bandColour } from "@/lib/views/palette";
import { formatQuantity } from "@/components/format";

// A decorative sketch for the landing page: nearest-neighbour square-lattice bands
// E(k) = e0 − 2t(cos kx + cos ky) (textbook tight-binding, e.g. Ashcroft & Mermin ch. 10) along Γ–X–M–Γ,
// drawn as model lines with a few "measured" points on top.
const width = 360;
const height = 200;
const pad = { left: 44, right: 10, top: 10, bottom: 24 };
const segments = [
  { from: [0, 0], to: [Math.PI, 0] },
  { from: [Math.PI, 0], to: [Math.PI, Math.PI] },
  { from: [Math.PI, Math.PI], to: [0, 0] },
] as const;
const bands = [
  { e0: -0.6, t: 0.45 },
  { e0: 0.9, t: -0.3 },
  { e0: 2.2, t: 0.2 },
];
const energyTicks = [-2, 0, 2];
const eMin = -2.6;
const eMax = 3.6;

function pathPoints(samplesPerSegment: number): Array<{ x: number; kx: number; ky: number }> {
  const points: Array<{ x: number; kx: number; ky: number }> = [];
  segments.forEach((segment, s) => {
    for (let i = 0; i <= samplesPerSegment; i += 1) {
      if (s > 0 && i === 0) continue;
      const f = i / samplesPerSegment;
      points.push({
        x: (s + f) / segments.length,
        kx: segment.from[0] + f * (segment.to[0] - segment.from[0]),
        ky: segment.from[1] + f * (segment.to[1] - segment.from[1]),
      });
    }
  });
  return points;
}

const toX = (x: number) => pad.left + x * (width - pad.left - pad.right);
const toY = (e: number) => pad.top + ((eMax - e) / (eMax - eMin)) * (height - pad.top - pad.bottom);
const energy = (band: (typeof bands)[number], kx: number, ky: number) => band.e0 - 2 * band.t * (Math.cos(kx) + Math.cos(ky));

/** Bands along Γ–X–M–Γ with data points: shows at a glance what the product fits. */
export function BandSketch() {
  const line = pathPoints(40);
  const dots = pathPoints(6);
  const ticks = [
    { x: 0, label: "Γ" },
    { x: 1 / 3, label: "X" },
    { x: 2 / 3, label: "M" },
    { x: 1, label: "Γ" },
  ];
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      className="h-auto w-full"
      role="img"
      aria-label="Sketch of three model bands along the k-path Γ–X–M–Γ with data points lying on them"
    >
      <rect x={pad.left} y={pad.top} width={width - pad.left - pad.right} height={height - pad.top - pad.bottom} fill="#fff" stroke="#d9dee1" />
      {ticks.map((tick) => (
        <g key={`${tick.label}-${tick.x}`}>
          <line x1={toX(tick.x)} x2={toX(tick.x)} y1={pad.top} y2={height - pad.bottom} stroke="#d9dee1" />
          <text x={toX(tick.x)} y={height - 8} textAnchor="middle" className="fill-ink-muted text-[11px]">
            {tick.label}
          </text>
        </g>
      ))}
      {energyTicks.map((e) => (
        <g key={e}>
          <line x1={pad.left - 4} x2={pad.left} y1={toY(e)} y2={toY(e)} stroke="#74818a" />
          <text x={pad.left - 6} y={toY(e) + 3.5} textAnchor="end" className="fill-ink-muted text-[10px]">
            {formatQuantity(e, { decimals: 0 })}
          </text>
        </g>
      ))}
      <text x={11} y={height / 2} transform={`rotate(-90 11 ${height / 2})`} textAnchor="middle" className="fill-ink-muted text-[10px]">
        E − E<tspan baselineShift="sub" fontSize="7">F</tspan> (eV)
      </text>
      {bands.map((band, b) => (
        <g key={b}>
          <polyline
            points={line.map((p) => `${toX(p.x).toFixed(1)},${toY(energy(band, p.kx, p.ky)).toFixed(1)}`).join(" ")}
            fill="none"
            stroke={bandColour(b === 2 ? 4 : b)}
            strokeWidth={1.6}
          />
          {dots.map((p, i) => (
            <circle
              key={i}
              cx={toX(p.x)}
              cy={toY(energy(band, p.kx, p.ky) + 0.08 * Math.sin(3 * i + b))}
              r={2.4}
              fill="#fff"
              stroke={bandColour(b === 2 ? 4 : b)}
              strokeWidth={1.2}
            />
          ))}
        </g>
      ))}
    </svg>
  );
}
