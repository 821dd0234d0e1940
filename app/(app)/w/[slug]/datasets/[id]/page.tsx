import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { BandScatterChart } from "@/components/charts/band-scatter-chart";
import { DatasetControls } from "@/components/datasets/dataset-controls";
import { DatasetSummaryList } from "@/components/datasets/dataset-summary";
import { PointsTable } from "@/components/datasets/points-table";
import { ButtonLink, Notice, PageHeader, Panel } from "@/components/ui";
import { getDataset, listDatasetPoints, sampleDatasetPoints, type DatasetDetails } from "@/db/queries/datasets";
import { hasRole } from "@/lib/auth/roles";
import { pointsQuerySchema } from "@/lib/schemas/datasets";
import { chartPointLimit } from "@/lib/server/datasets/chart-points";
import { isDatasetId } from "@/lib/server/datasets/dataset-access";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Dataset" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

async function Chart({ dataset }: { dataset: DatasetDetails }) {
  const { points, stride } = await sampleDatasetPoints({ datasetId: dataset.id, pointCount: dataset.pointCount, bandCount: dataset.bandCount, maxPoints: chartPointLimit });
  const thinned = stride > 1;
  return (
    <>
      <BandScatterChart
        points={points.map((p) => ({ pathDistance: p.pathDistance, energy: p.energy, band: p.band }))}
        ticks={dataset.summary.ticks}
        description={`Energy in eV against path distance in 1/Å for ${dataset.bandCount} bands, ${points.length} points drawn${thinned ? ` of ${dataset.pointCount}` : ""}. The table below lists every point.`}
      />
      {thinned ? (
        <p className="mt-2 text-xs text-ink-muted">
          Drawn: one in {stride} points of each band ({points.length.toLocaleString("en-US")} of {dataset.pointCount.toLocaleString("en-US")}). The table lists all.
        </p>
      ) : null}
    </>
  );
}

async function Points({ dataset, searchParams }: { dataset: DatasetDetails; searchParams: Record<string, string | string[] | undefined> }) {
  const single = Object.fromEntries(Object.entries(searchParams).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));
  const parsed = pointsQuerySchema.safeParse({ band: single.band, page: single.page, sort: single.sort, pageSize: 50 });
  const query = parsed.success ? parsed.data : pointsQuerySchema.parse({ pageSize: 50 });
  const { points, total } = await listDatasetPoints({
    datasetId: dataset.id,
    band: query.band,
    page: query.page,
    pageSize: query.pageSize,
    sort: query.sort.column,
    direction: query.sort.direction,
  });
  return (
    <>
      {parsed.success ? null : <Notice tone="warning" className="m-4">The address asked for an unknown sort or page; showing the first page in file order.</Notice>}
      <PointsTable points={points} total={total} page={query.page} pageSize={query.pageSize} sort={query.sort} band={query.band} bands={dataset.summary.bands} />
    </>
  );
}

export default async function DatasetPage({ params, searchParams }: { params: Promise<{ slug: string; id: string }>; searchParams: SearchParams }) {
  const { slug, id } = await params;
  const { workspace, role } = await requireWorkspaceMember(slug, "viewer");
  if (!isDatasetId(id)) notFound();
  const dataset = await getDataset({ workspaceId: workspace.id, id });
  if (!dataset) notFound();
  const canChange = hasRole(role, "editor");
  const fileHref = `/api/workspaces/${workspace.slug}/datasets/${dataset.id}/file`;

  return (
    <>
      <PageHeader
        eyebrow="Dataset"
        title={dataset.name}
        description={dataset.description || undefined}
        actions={
          <div className="flex flex-wrap items-start gap-2">
            <ButtonLink href={`/w/${workspace.slug}/fits?dataset=${dataset.id}`} variant="secondary" size="sm">
              Fits of this dataset
            </ButtonLink>
            {canChange ? (
              <ButtonLink href={`/w/${workspace.slug}/fits/new?dataset=${dataset.id}`} size="sm">
                New fit on this dataset
              </ButtonLink>
            ) : null}
            <ButtonLink href={fileHref} variant="secondary" size="sm" download={dataset.fileName}>
              Download original
            </ButtonLink>
            {canChange ? <DatasetControls slug={workspace.slug} id={dataset.id} name={dataset.name} description={dataset.description} /> : null}
          </div>
        }
      />
      <div className="flex flex-col gap-6">
        {dataset.summary.warnings?.length ? (
          <Notice tone="warning" title="Warnings from the upload">
            <ul className="list-disc pl-5">
              {dataset.summary.warnings.map((warning) => (
                <li key={warning}>{warning}</li>
              ))}
            </ul>
          </Notice>
        ) : null}
        <Panel title="Bands" description="Data points coloured by band; labelled k-points on the axis.">
          <Suspense fallback={<p className="h-[420px] text-sm text-ink-muted">Loading the chart…</p>}>
            <Chart dataset={dataset} />
          </Suspense>
        </Panel>
        <Panel title="Summary">
          <DatasetSummaryList dataset={dataset} />
        </Panel>
        <Panel title="Points" description="Sorted and paged on the server; k in 1/Å, energies and σ in eV." flush>
          <Suspense fallback={<p className="p-4 text-sm text-ink-muted">Loading points…</p>}>
            <Points dataset={dataset} searchParams={await searchParams} />
          </Suspense>
        </Panel>
      </div>
    </>
  );
}
