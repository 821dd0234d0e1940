"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cx } from "@/components/ui";

/** Sections of a workspace, in the order they appear in its navigation. */
const sections = [
  { label: "Home", path: "" },
  { label: "Datasets", path: "/datasets" },
  { label: "Fits", path: "/fits" },
  { label: "Members", path: "/members" },
  { label: "API keys", path: "/settings/api-keys" },
] as const;

/** Tabs of one workspace; the current section is marked with aria-current for screen readers. */
export function WorkspaceNav({ slug }: { slug: string }) {
  const pathname = usePathname();
  const base = `/w/${encodeURIComponent(slug)}`;
  return (
    <nav aria-label="Workspace" className="-mb-px flex flex-wrap gap-x-1">
      {sections.map((section) => {
        const href = `${base}${section.path}`;
        const current = section.path === "" ? pathname === base : pathname.startsWith(href);
        return (
          <Link
            key={section.label}
            href={href}
            aria-current={current ? "page" : undefined}
            className={cx(
              "border-b-2 px-2.5 py-2 text-sm font-medium whitespace-nowrap no-underline hover:no-underline sm:px-3",
              current ? "border-accent-600 text-ink" : "border-transparent text-ink-muted hover:border-line-strong hover:text-ink",
            )}
          >
            {section.label}
          </Link>
        );
      })}
    </nav>
  );
}
