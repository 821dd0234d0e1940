import type { ReactNode } from "react";
import { Brand } from "@/components/shell/brand";
import { SkipLink } from "@/components/shell/skip-link";

/** Shell of the signed-out pages: a quiet header and a centred column. */
export default function PublicLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <header className="border-b border-line bg-surface">
        <div className="mx-auto flex h-12 max-w-page items-center px-4">
          <Brand />
        </div>
      </header>
      <main id="content" tabIndex={-1} className="flex-1 outline-none">
        {children}
      </main>
      <footer className="border-t border-line bg-surface py-4 text-center text-xs text-ink-faint">
        Bandwright — tight-binding fits for band-structure data.
      </footer>
    </div>
  );
}
