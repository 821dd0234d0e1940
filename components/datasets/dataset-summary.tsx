import { formatDateTime, formatQuantity } from "@/components/format";
import type { DatasetDetails } from "@/db/queries/datasets";

const range = (min: number, max: number, unit: string) => `${formatQuantity(min, { decimals: 3 })} to ${formatQuantity(max, { decimals: 3, unit })}`;

/** The facts of a dataset as a definition list: counts, ranges with units, provenance. */
export function DatasetSummaryList({ dataset }: { dataset: DatasetDetails }) {
  const s = dataset.summary;
  const items: [string, string][] = [
    ["Points", s.pointCount.toLocaleString("en-US")],
    ["Bands", `${s.bandCount} (${s.bands[0]}–${s.bands.at(-1)})`],
    ["k-points", s.kPointCount.toLocaleString("en-US")],
    ["Path distance", range(s.pathDistanceRange.min, s.pathDistanceRange.max, "1/Å")],
    ["kx, ky, kz", [0, 1, 2].map((i) => range(s.kRange.min[i], s.kRange.max[i], "1/Å")).join("; ")],
    ["Energy", range(s.energyRange.min, s.energyRange.max, "eV")],
    ["Source", dataset.source === "calculation" ? "Calculation" : "Photoemission"],
    ["Energy reference", dataset.energyReference ?? "not given"],
    ["Format", `${dataset.mapping.format === "wide" ? "Wide" : "Long"}, k as ${dataset.mapping.k.kind}${s.hasSigma ? ", with σ" : ""}${s.hasLabel ? ", with labels" : ""}`],
    ["Uploaded by", dataset.uploaderName ?? "a former member"],
    ["Uploaded", formatDateTime(dataset.createdAt)],
    ["File", `${dataset.fileName} (${dataset.fileSize.toLocaleString("en-US")} bytes)`],
  ];
  return (
    <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
      {items.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="text-ink-muted">{term}</dt>
          <dd className="tabular-nums text-ink">{value}</dd>
        </div>
      ))}
      <dt className="text-ink-muted">SHA-256</dt>
      <dd className="break-all font-mono text-xs text-ink">{dataset.fileSha256}</dd>
    </dl>
  );
}
