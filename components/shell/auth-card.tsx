import type { ReactNode } from "react";

/** The centred card every sign-in style page uses. */
export function AuthCard({ title, description, children }: { title: string; description?: ReactNode; children: ReactNode }) {
  return (
    <div className="mx-auto w-full max-w-sm px-4 py-12">
      <div className="rounded-lg border border-line bg-surface p-6 shadow-sm">
        <h1 className="text-lg">{title}</h1>
        {description ? <p className="mt-1 text-sm text-ink-muted">{description}</p> : null}
        <div className="mt-5">{children}</div>
      </div>
    </div>
  );
}
