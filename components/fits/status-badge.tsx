import { Badge, type BadgeTone } from "@/components/ui";
import type { RevisionStatusName } from "@/lib/views/responses";

const tones: Record<RevisionStatusName, BadgeTone> = { queued: "neutral", running: "accent", succeeded: "success", failed: "danger", cancelled: "caution" };
const labels: Record<RevisionStatusName, string> = { queued: "queued", running: "running", succeeded: "finished", failed: "failed", cancelled: "cancelled" };

/** A revision's status as a badge (the word is always written, colour is a second cue). */
export function StatusBadge({ status }: { status: RevisionStatusName | null }) {
  return status ? <Badge tone={tones[status]}>{labels[status]}</Badge> : <Badge>no revision</Badge>;
}
