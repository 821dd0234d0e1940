import { markerPath } from "@/lib/views/markers";
import type { BandMarker } from "@/lib/views/palette";

/** A band's marker in its colour, for legends (decorative: the label beside it names the band). */
export function MarkerIcon({ marker, colour }: { marker: BandMarker; colour: string }) {
  return (
    <svg aria-hidden="true" viewBox="0 0 12 12" className="inline-block size-3 shrink-0">
      <path d={markerPath(marker, 6, 6, 4)} fill={colour} />
    </svg>
  );
}
