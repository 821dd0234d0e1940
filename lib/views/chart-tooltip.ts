/** What recharts hands a custom tooltip: one entry per plotted value (scatter points give both x and y). */
export interface TooltipEntry {
  dataKey?: unknown;
  value?: unknown;
  /** the `id` given to the Scatter or Line */
  graphicalItemId?: string;
  color?: string;
}

/** A tooltip with the path position once and one value per series. */
export interface TooltipSummary {
  /** path distance, 1/Å; null when no entry carried it */
  x: number | null;
  rows: { id: string; label: string; value: number; colour: string | undefined }[];
}

/**
 * Folds recharts' tooltip entries into one x value and one row per series: a chart with a dozen band
 * series otherwise repeats the same x once per band.
 * @param entries - the tooltip payload
 * @param labels - series id → the label shown for it
 * @param xKey - the data key of the path-distance axis
 */
export function tooltipSummary(entries: readonly TooltipEntry[], labels: ReadonlyMap<string, string>, xKey = "x"): TooltipSummary {
  let x: number | null = null;
  const rows: TooltipSummary["rows"] = [];
  const seen = new Set<string>();
  for (const entry of entries) {
    if (typeof entry.value !== "number" || !Number.isFinite(entry.value)) continue;
    if (entry.dataKey === xKey) {
      x ??= entry.value;
      continue;
    }
    const id = entry.graphicalItemId ?? String(entry.dataKey);
    if (seen.has(id)) continue;
    seen.add(id);
    rows.push({ id, label: labels.get(id) ?? id, value: entry.value, colour: entry.color });
  }
  return { x, rows };
}

/**
 * Sort key of a legend or tooltip item by the band number in its label ("band 10" → 10), so items come
 * as 1, 2, …, 10 rather than in text order 1, 10, 11, 2; labels without a number go last.
 */
export function bandSortKey(label: string): number {
  const match = /\d+/.exec(label);
  return match ? Number(match[0]) : Number.MAX_SAFE_INTEGER;
}
