"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { formatDateTime, formatQuantity } from "@/components/format";
import { Button, Notice, Panel, Select } from "@/components/ui";
import { fitApi } from "./api";
import { StatusBadge } from "./status-badge";

function duration(start: string | null, end: string | null): string {
  if (!start || !end) return "—";
  const seconds = (new Date(end).getTime() - new Date(start).getTime()) / 1000;
  return `${seconds.toFixed(1)} s`;
}

/** A fit's revisions (status, RMS, time) and the picker that compares two of them. */
export function RevisionsList({ slug, fitId }: { slug: string; fitId: string }) {
  const router = useRouter();
  const fit = useQuery({
    queryKey: ["fit", slug, fitId],
    queryFn: () => fitApi.getFit(slug, fitId),
    refetchInterval: (q) => (q.state.data?.fit.revisions.some((r) => r.status === "queued" || r.status === "running") ? 2000 : false),
  });
  const [pair, setPair] = useState<{ a: string; b: string }>({ a: "", b: "" });
  if (fit.isPending) return <p className="text-sm text-ink-muted">Loading revisions…</p>;
  if (fit.error) return <Notice tone="error">{fit.error.message}</Notice>;
  const revisions = fit.data.fit.revisions;
  const finished = revisions.filter((r) => r.status === "succeeded" || r.status === "cancelled");
  const a = pair.a || String(finished[finished.length - 2]?.number ?? "");
  const b = pair.b || String(finished[finished.length - 1]?.number ?? "");
  return (
    <div className="flex flex-col gap-6">
      <Panel title="Revisions" flush>
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-sm">
            <caption className="sr-only">Revisions of this fit</caption>
            <thead className="bg-surface-sunken text-xs uppercase tracking-wide text-ink-muted">
              <tr>
                {["Revision", "From", "Status", "RMS", "Launched by", "Launched", "Run time"].map((h, i) => (
                  <th key={h} scope="col" className={`border-y border-line px-4 py-2 font-semibold ${i === 1 || i === 3 || i === 6 ? "text-right" : "text-left"}`}>
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {revisions.map((r) => (
                <tr key={r.number} className="border-b border-line last:border-b-0">
                  <td className="px-4 py-2">
                    <Link className="font-medium text-accent-700 hover:underline" href={`/w/${slug}/fits/${fitId}/revisions/${r.number}`}>
                      Revision {r.number}
                    </Link>
                  </td>
                  <td className="px-4 py-2 text-right tabular-nums">{r.parentNumber ?? "—"}</td>
                  <td className="px-4 py-2"><StatusBadge status={r.status} /></td>
                  <td className="px-4 py-2 text-right tabular-nums">{r.rms === null ? "—" : formatQuantity(r.rms, { unit: "eV", decimals: 4 })}</td>
                  <td className="px-4 py-2">{r.launchedBy ?? "—"}</td>
                  <td className="px-4 py-2 tabular-nums">{formatDateTime(new Date(r.createdAt))}</td>
                  <td className="px-4 py-2 text-right tabular-nums">{duration(r.startedAt, r.finishedAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Panel>
      <Panel title="Compare two revisions" description="Parameters side by side with their differences, RMS per band, and both models over the data.">
        {finished.length < 2 ? (
          <p className="text-sm text-ink-muted">Two finished revisions are needed; start a new revision from a finished one.</p>
        ) : (
          <form
            className="flex flex-wrap items-end gap-3"
            onSubmit={(e) => {
              e.preventDefault();
              router.push(`/w/${slug}/fits/${fitId}/compare?a=${a}&b=${b}`);
            }}
          >
            {(["a", "b"] as const).map((side) => (
              <label key={side} className="flex flex-col gap-1 text-sm font-medium" htmlFor={`compare-${side}`}>
                {side === "a" ? "Revision" : "with revision"}
                <Select id={`compare-${side}`} value={side === "a" ? a : b} onChange={(e) => setPair({ a, b, [side]: e.target.value })}>
                  {finished.map((r) => (
                    <option key={r.number} value={r.number}>
                      {r.number}
                    </option>
                  ))}
                </Select>
              </label>
            ))}
            <Button type="submit" disabled={a === b}>
              Compare
            </Button>
          </form>
        )}
      </Panel>
    </div>
  );
}
