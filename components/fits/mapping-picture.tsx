import type { BandPair } from "@/lib/views/band-mapping";

/** A small picture of the band mapping: each data band with an arrow to its model band. */
export function MappingPicture({ pairs, colours }: { pairs: BandPair[]; colours: ReadonlyMap<number, string> }) {
  return (
    <ul aria-label="Which data band is compared with which model band" className="flex flex-col gap-1 text-sm tabular-nums">
      {pairs.map((p) => (
        <li key={p.dataBand} className="flex items-center gap-2">
          <span aria-hidden="true" className="inline-block size-2.5 rounded-full" style={{ backgroundColor: colours.get(p.dataBand) }} />
          <span className="w-24">data band {p.dataBand}</span>
          <span aria-hidden="true" className="text-ink-faint">→</span>
          {p.outOfRange ? (
            <span className="font-medium text-danger-700">model band {p.modelBand} (the model has no such band)</span>
          ) : p.modelBand === null ? (
            <span className="text-ink-muted">{pairs.every((q) => q.modelBand === null) ? "nearest model band, per point" : "left out"}</span>
          ) : (
            <span>model band {p.modelBand}</span>
          )}
        </li>
      ))}
    </ul>
  );
}
