import type { ReactNode } from "react";

interface EmptyStateProps {
  title: string;
  /** What to do next — an empty state always points somewhere. */
  description: ReactNode;
  action?: ReactNode;
  /** A small decorative drawing; hidden from screen readers. */
  illustration?: ReactNode;
}

/** Shown where a list or view has nothing yet; says what to do next. */
export function EmptyState({ title, description, action, illustration }: EmptyStateProps) {
  return (
    <div className="flex flex-col items-center gap-3 rounded-lg border border-dashed border-line-strong bg-surface-raised px-6 py-10 text-center">
      {illustration ? <div aria-hidden="true" className="text-accent-500">{illustration}</div> : null}
      <h3 className="text-base">{title}</h3>
      <p className="max-w-md text-sm text-ink-muted">{description}</p>
      {action ? <div className="mt-1">{action}</div> : null}
    </div>
  );
}
