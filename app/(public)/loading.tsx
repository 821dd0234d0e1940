/** Shown while a signed-out page's server work runs. */
export default function PublicLoading() {
  return (
    <p role="status" className="mx-auto max-w-page px-4 py-12 text-sm text-ink-muted">
      Loading…
    </p>
  );
}
