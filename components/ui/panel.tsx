import type { ReactNode } from "react";
import { cx } from "./class-names";

interface PanelProps {
  /** Heading of the panel (rendered as h2 unless `headingLevel` says otherwise). */
  title?: string;
  headingLevel?: 2 | 3;
  description?: ReactNode;
  /** Controls aligned to the right of the heading. */
  actions?: ReactNode;
  children: ReactNode;
  /** Drop the inner padding, for tables that run edge to edge. */
  flush?: boolean;
  className?: string;
}

/** A white, bordered section of a page. */
export function Panel({ title, headingLevel = 2, description, actions, children, flush, className }: PanelProps) {
  const Heading = headingLevel === 2 ? "h2" : "h3";
  const hasHeader = Boolean(title || description || actions);
  return (
    <section className={cx("rounded-lg border border-line bg-surface shadow-sm", className)}>
      {hasHeader ? (
        <header className="flex items-start justify-between gap-4 border-b border-line px-4 py-3">
          <div className="min-w-0">
            {title ? <Heading className="text-base">{title}</Heading> : null}
            {description ? <p className="mt-0.5 text-sm text-ink-muted">{description}</p> : null}
          </div>
          {actions ? <div className="flex shrink-0 items-center gap-2">{actions}</div> : null}
        </header>
      ) : null}
      <div className={flush ? undefined : "p-4"}>{children}</div>
    </section>
  );
}
