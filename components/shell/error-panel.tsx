"use client";

import { Button, ButtonLink, Notice } from "@/components/ui";

interface ErrorPanelProps {
  error: Error & { digest?: string };
  reset: () => void;
  /** Where "Go back" leads; defaults to the workspace list. */
  backHref?: string;
}

/**
 * What a route segment shows when its server work fails. Production hides server messages, so the
 * text stays generic and quotes the digest that matches the server log line.
 */
export function ErrorPanel({ error, reset, backHref = "/workspaces" }: ErrorPanelProps) {
  return (
    <div className="mx-auto max-w-xl px-4 py-12">
      <Notice tone="error" title="This page could not be shown">
        <p>
          Something failed while loading it. Try again; if it keeps failing, your role may not allow this page — ask a
          workspace owner.
        </p>
        {error.digest ? <p className="mt-1 text-xs">Reference: {error.digest}</p> : null}
      </Notice>
      <div className="mt-4 flex gap-2">
        <Button onClick={reset}>Try again</Button>
        <ButtonLink href={backHref} variant="secondary">
          Go back
        </ButtonLink>
      </div>
    </div>
  );
}
