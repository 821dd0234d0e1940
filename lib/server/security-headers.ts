// Security headers (pure: used by next.config.ts and proxy.ts, unit-tested). Every response carries the
// common headers; pages get a nonce-based Content-Security-Policy from proxy.ts, API answers one that
// allows nothing (they are JSON or files, never documents that run code).

/**
 * On every response, static files included (next.config.ts `headers()`). Referrer-Policy: reset and
 * invitation links carry their token in the URL, so other sites get at most our origin. Not `no-referrer`:
 * under it browsers send `Origin: null` on same-origin POSTs (Fetch standard, "append a request `Origin`
 * header"), and better-auth and server actions refuse those.
 */
export const commonSecurityHeaders = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
] as const;

/** For API answers: nothing may load or run in them, and no page may frame them. */
export const apiContentSecurityPolicy = "default-src 'none'; frame-ancestors 'none'";

/** A fresh nonce: 128 random bits, base64 (CSP Level 3 asks for at least 128 bits). */
export function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return btoa(String.fromCharCode(...bytes));
}

/**
 * The policy of a page. Next reads the nonce from this header on the request and stamps it on its own
 * scripts and style elements; 'strict-dynamic' lets those scripts load the chunks they need.
 * - style-src-attr 'unsafe-inline': React renders `style` attributes (recharts' chart sizes and positions,
 *   progress bars) into the HTML, and a nonce cannot cover attributes. CSS cannot run script, so this is
 *   the one inline allowance; <style> elements still need the nonce.
 * - development (`next dev`) adds 'unsafe-eval' (React rebuilds server error stacks with eval) and inline
 *   styles (hot reloading injects <style> elements without a nonce), as Next's CSP guide says.
 * - upgrade-insecure-requests only when the app itself is served over https: on http://127.0.0.1 it would
 *   send the page's own scripts to an https port that does not exist.
 */
export function pageContentSecurityPolicy(options: { nonce: string; development: boolean; https: boolean }): string {
  const { nonce, development, https } = options;
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ""}`,
    development ? "style-src 'self' 'unsafe-inline'" : `style-src 'self' 'nonce-${nonce}'`,
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(https ? ["upgrade-insecure-requests"] : []),
  ];
  return directives.join("; ");
}
