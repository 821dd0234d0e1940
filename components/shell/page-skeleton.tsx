/** Placeholder while a page's data loads: announces progress and keeps the layout steady. */
export function PageSkeleton({ label }: { label: string }) {
  return (
    <div className="mx-auto max-w-page px-4 py-8" aria-busy="true">
      <p role="status" className="sr-only">
        {label}
      </p>
      <div aria-hidden="true" className="animate-pulse">
        <div className="h-6 w-64 rounded bg-line" />
        <div className="mt-2 h-4 w-96 max-w-full rounded bg-line/70" />
        <div className="mt-8 h-40 rounded-lg border border-line bg-surface" />
      </div>
    </div>
  );
}
