import type { Metadata } from "next";
import Link from "next/link";
import { StatusBadge } from "@/components/fits/status-badge";
import { formatDate } from "@/components/format";
import { ButtonLink, EmptyState, PageHeader, Panel } from "@/components/ui";
import { getWorkspaceOverview, type WorkspaceOverview } from "@/db/queries/workspace-overview";
import { listMembers } from "@/db/queries/workspaces";
import { hasRole } from "@/lib/auth/roles";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Workspace" };

const sourceLabels = { calculation: "calculation", photoemission: "photoemission" } as const;

function plural(n: number, one: string, many: string): string {
  return `${n.toLocaleString("en")} ${n === 1 ? one : many}`;
}

function DatasetList({ base, datasets }: { base: string; datasets: WorkspaceOverview["latestDatasets"] }) {
  return (
    <ul className="divide-y divide-line">
      {datasets.map((d) => (
        <li key={d.id} className="flex items-baseline justify-between gap-3 px-4 py-2">
          <Link href={`${base}/datasets/${d.id}`} className="truncate font-medium">
            {d.name}
          </Link>
          <span className="shrink-0 text-xs text-ink-muted tabular-nums">
            {sourceLabels[d.source]} · {plural(d.bandCount, "band", "bands")} · {plural(d.pointCount, "point", "points")} ·{" "}
            {formatDate(d.createdAt)}
          </span>
        </li>
      ))}
    </ul>
  );
}

function FitList({ base, fits }: { base: string; fits: WorkspaceOverview["latestFits"] }) {
  return (
    <ul className="divide-y divide-line">
      {fits.map((f) => (
        <li key={f.id} className="flex items-baseline justify-between gap-3 px-4 py-2">
          <Link href={`${base}/fits/${f.id}`} className="truncate font-medium">
            {f.name}
          </Link>
          <span className="flex shrink-0 items-center gap-2 text-xs text-ink-muted tabular-nums">
            {f.latestRevision !== null ? <span>revision {f.latestRevision}</span> : null}
            <StatusBadge status={f.latestStatus} />
            <span>{formatDate(f.createdAt)}</span>
          </span>
        </li>
      ))}
    </ul>
  );
}

export default async function WorkspaceHomePage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { workspace, role } = await requireWorkspaceMember(slug, "viewer");
  const [members, overview] = await Promise.all([listMembers(workspace.id), getWorkspaceOverview(workspace.id)]);
  const base = `/w/${workspace.slug}`;
  const canEdit = hasRole(role, "editor");

  return (
    <>
      <PageHeader title="Overview" description="Band data, tight-binding models and fits of this workspace." />
      <div className="grid gap-6 md:grid-cols-2">
        {overview.datasetCount === 0 ? (
          <Panel title="Datasets" description="Band energies from DFT or ARPES, kept byte for byte.">
            <EmptyState
              title="No datasets yet"
              description={
                canEdit
                  ? "Upload a CSV or TSV of band energies along a k-path (DFT) or peak positions with error bars (ARPES) to begin."
                  : "An editor or owner uploads band data here; you will see it as soon as it arrives."
              }
              action={
                <ButtonLink href={canEdit ? `${base}/datasets/new` : `${base}/datasets`} variant={canEdit ? "primary" : "secondary"}>
                  {canEdit ? "Upload a dataset" : "Open datasets"}
                </ButtonLink>
              }
            />
          </Panel>
        ) : (
          <Panel title="Datasets" description={`${plural(overview.datasetCount, "dataset", "datasets")}, newest first.`} flush>
            <DatasetList base={base} datasets={overview.latestDatasets} />
            <p className="flex gap-3 border-t border-line px-4 py-2 text-sm">
              <Link href={`${base}/datasets`}>All datasets</Link>
              {canEdit ? <Link href={`${base}/datasets/new`}>Upload a dataset</Link> : null}
            </p>
          </Panel>
        )}
        {overview.fitCount === 0 ? (
          <Panel title="Fits" description="Tight-binding parameters fitted to a dataset, revision by revision.">
            <EmptyState
              title="No fits yet"
              description={
                canEdit
                  ? overview.datasetCount === 0
                    ? "Once a dataset is in, pick a model template, choose the free parameters and launch a fit."
                    : "Pick a dataset and a model template, choose the free parameters and launch a fit."
                  : "Fits launched by editors appear here with χ², RMS per band and parameters ± errors."
              }
              action={
                <ButtonLink href={canEdit && overview.datasetCount > 0 ? `${base}/fits/new` : `${base}/fits`} variant="secondary">
                  {canEdit ? "Start a fit" : "Open fits"}
                </ButtonLink>
              }
            />
          </Panel>
        ) : (
          <Panel title="Fits" description={`${plural(overview.fitCount, "fit", "fits")}, newest first.`} flush>
            <FitList base={base} fits={overview.latestFits} />
            <p className="flex gap-3 border-t border-line px-4 py-2 text-sm">
              <Link href={`${base}/fits`}>All fits</Link>
              {canEdit ? <Link href={`${base}/fits/new`}>Start a fit</Link> : null}
            </p>
          </Panel>
        )}
      </div>
      <p className="mt-6 text-sm text-ink-muted">
        <span className="tabular-nums">{members.length}</span> {members.length === 1 ? "member" : "members"} ·{" "}
        <Link href={`${base}/members`}>{role === "owner" ? "Manage members" : "See members"}</Link>
      </p>
    </>
  );
}
