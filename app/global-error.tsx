"use client";

import "./globals.css";

/** Last resort when the root layout itself fails; it replaces the whole document. */
export default function GlobalError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body className="min-h-screen p-8">
        <h1 className="text-lg">Bandwright could not load</h1>
        <p className="mt-2 text-sm text-ink-muted">Something failed before the page could be shown. Try again in a moment.</p>
        {error.digest ? <p className="mt-1 text-xs text-ink-faint">Reference: {error.digest}</p> : null}
        <button type="button" onClick={reset} className="mt-4 rounded-md bg-accent-700 px-3 py-1.5 text-white">
          Try again
        </button>
      </body>
    </html>
  );
}
