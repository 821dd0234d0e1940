/** A labelled position on a chart's path-distance axis (1/Å). */
export interface PathTick {
  /** high-symmetry label, e.g. "Γ"; joined with "|" where the path jumps (e.g. "K|U") */
  label: string;
  /** path distance, 1/Å */
  position: number;
}

/** Ticks closer than this fraction of the axis span are one tick: a path jump puts two labels at one place. */
const COINCIDENT_FRACTION = 1e-6;

/** Greek names that files often spell out, shown as the letter physicists write. */
const LABEL_LETTERS: Record<string, string> = { G: "Γ", GAMMA: "Γ", GM: "Γ", DELTA: "Δ", SIGMA: "Σ", LAMBDA: "Λ" };

/**
 * The label as physicists write it: "G", "Gamma" and "\Gamma" become Γ; other labels are kept.
 * @param label - a high-symmetry point label as read from a file or a template
 */
export function displayLabel(label: string): string {
  const bare = label.trim().replace(/^\\/, "");
  return LABEL_LETTERS[bare.toUpperCase()] ?? bare;
}

/**
 * Axis ticks for a band chart: sorted by position, Greek labels spelled as letters, and labels at the
 * same position (a jump in the path) merged as "A|B" in path order.
 * @param ticks - labels with their path distance, 1/Å, in any order
 */
export function pathTicks(ticks: readonly { label: string; position: number }[]): PathTick[] {
  if (ticks.length === 0) return [];
  const sorted = ticks.map((t, order) => ({ ...t, order })).sort((a, b) => a.position - b.position || a.order - b.order);
  const span = sorted[sorted.length - 1].position - sorted[0].position;
  const tolerance = Math.max(span * COINCIDENT_FRACTION, Number.EPSILON);
  const merged: PathTick[] = [];
  for (const tick of sorted) {
    const label = displayLabel(tick.label);
    const last = merged[merged.length - 1];
    if (last && Math.abs(tick.position - last.position) <= tolerance) {
      if (!last.label.split("|").includes(label)) last.label = `${last.label}|${label}`;
    } else merged.push({ label, position: tick.position });
  }
  return merged;
}

/**
 * Formats a tick position for recharts' tick formatter: the label at that position, or "" elsewhere.
 * @param ticks - from {@link pathTicks}
 */
export function tickLabeller(ticks: readonly PathTick[]): (position: number) => string {
  const byPosition = new Map(ticks.map((t) => [t.position, t.label]));
  return (position) => byPosition.get(position) ?? "";
}
