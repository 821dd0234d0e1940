import Link from "next/link";

/** The Bandwright word mark with its small band-curve glyph; links home. */
export function Brand({ href = "/" }: { href?: string }) {
  return (
    <Link href={href} className="inline-flex items-center gap-2 text-ink no-underline hover:no-underline">
      <svg viewBox="0 0 32 32" className="h-6 w-6" aria-hidden="true">
        <rect width="32" height="32" rx="6" className="fill-accent-700" />
        <path d="M5 22 C10 8, 14 8, 16 16 S22 24, 27 10" fill="none" stroke="#fff" strokeWidth="2.5" strokeLinecap="round" />
        <path d="M5 12 C10 24, 14 24, 16 16" fill="none" className="stroke-accent-200" strokeWidth="2" strokeLinecap="round" />
      </svg>
      <span className="text-base font-semibold tracking-tight">Bandwright</span>
    </Link>
  );
}
