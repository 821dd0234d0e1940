"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Button, Notice } from "@/components/ui";
import type { RevisionDetails } from "@/lib/views/responses";
import { fitApi } from "./api";

function formatChiSquared(value: number): string {
  return value.toPrecision(4).replace("-", "\u2212");
}

/** Iteration, χ² and a progress bar (iterations out of the limit) while a revision is queued or running. */
export function ProgressPanel({ slug, fitId, revision, canCancel }: { slug: string; fitId: string; revision: RevisionDetails; canCancel: boolean }) {
  const client = useQueryClient();
  const cancel = useMutation({
    mutationFn: () => fitApi.cancel(slug, fitId, revision.number),
    onSettled: () => client.invalidateQueries({ queryKey: ["revision", slug, fitId, revision.number] }),
  });
  const { progress, inputs } = revision;
  const maxIterations = inputs.options.maxIterations;
  const starts = progress?.starts ?? inputs.options.starts;
  const done = progress ? (progress.start * maxIterations + progress.iteration) / (starts * maxIterations) : 0;
  const percent = Math.min(100, Math.round(done * 100));
  return (
    <section aria-labelledby="progress-heading" className="rounded-lg border border-accent-200 bg-accent-50 p-4">
      <div className="flex items-start justify-between gap-4">
        <div>
          <h2 id="progress-heading" className="text-base">
            {revision.status === "queued" ? "Waiting for a worker" : "Fitting"}
          </h2>
          <p className="mt-0.5 text-sm text-ink-muted tabular-nums" aria-live="polite">
            {progress
              ? `Start ${progress.start + 1} of ${starts} · iteration ${progress.iteration} of at most ${maxIterations} · χ² = ${formatChiSquared(progress.chiSquared)}`
              : "Queued; it starts as soon as a worker is free."}
          </p>
        </div>
        {canCancel ? (
          <Button variant="danger" size="sm" onClick={() => cancel.mutate()} disabled={cancel.isPending}>
            {cancel.isPending ? "Cancelling…" : "Cancel fit"}
          </Button>
        ) : null}
      </div>
      <div
        role="progressbar"
        aria-label="Fit progress"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        aria-valuetext={progress ? `iteration ${progress.iteration}, χ² ${formatChiSquared(progress.chiSquared)}` : "queued"}
        className="mt-3 h-2 overflow-hidden rounded-full bg-white"
      >
        <div className="h-full bg-accent-700 transition-[width]" style={{ width: `${Math.max(percent, 2)}%` }} />
      </div>
      <p className="mt-1 text-xs text-ink-muted">The bar counts iterations against the limit; most fits stop earlier, when χ² no longer improves.</p>
      {cancel.error ? <Notice tone="error" className="mt-3">{cancel.error.message}</Notice> : null}
    </section>
  );
}
