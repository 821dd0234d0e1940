"use client";

import { Notice } from "@/components/ui";
import { useRevision } from "./hooks";
import { draftFromRevision } from "@/lib/views/launch-draft";
import { LaunchForm } from "./launch-form";

/** The launch form pre-filled from revision `from` (fitted values as start values). */
export function NewRevisionForm({ slug, fitId, from }: { slug: string; fitId: string; from: number }) {
  const revision = useRevision(slug, fitId, from);
  if (revision.isPending) return <p className="text-sm text-ink-muted">Loading revision {from}…</p>;
  if (revision.error) return <Notice tone="error">{revision.error.message}</Notice>;
  return <LaunchForm slug={slug} mode={{ kind: "new-revision", fitId, from, initial: draftFromRevision(revision.data, revision.data.fitName) }} />;
}
