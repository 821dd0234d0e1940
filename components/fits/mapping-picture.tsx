import { MarkerIcon } from "@/components/charts/marker-icon";
import type { BandStyle } from "@/lib/views/band-colours";
import type { BandPair } from "@/lib/views/band-mapping";

/** A small picture of the band mapping: each data band with an arrow to its model band. */
export function MappingPicture({ pairs, styles }: { pairs: BandPair[]; styles: ReadonlyMap<number, BandStyle> }) {
  return (
    <ul aria-label="Which data band is compared with which model band" className="flex flex-col gap-1 text-sm tabular-nums">
      {pairs.map((p) => (
        <li key={p.dataBand} className="flex items-center gap-2">
          {styles.get(p.dataBand) ? <MarkerIcon marker={styles.get(p.dataBand)!.marker} colour={styles.get(p.dataBand)!.colour} /> : null}
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
