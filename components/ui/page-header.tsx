import type { ReactNode } from "react";

interface PageHeaderProps {
  title: string;
  /** A short line under the title: what this page is for. */
  description?: ReactNode;
  /** Small text above the title, e.g. the workspace name. */
  eyebrow?: ReactNode;
  actions?: ReactNode;
}

/** The h1 of a page with its description and primary actions. */
export function PageHeader({ title, description, eyebrow, actions }: PageHeaderProps) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div className="min-w-0">
        {eyebrow ? <p className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-faint">{eyebrow}</p> : null}
        <h1 className="text-xl">{title}</h1>
        {description ? <p className="mt-1 max-w-2xl text-base text-ink-muted">{description}</p> : null}
      </div>
      {actions ? <div className="flex items-center gap-2">{actions}</div> : null}
    </div>
  );
}
