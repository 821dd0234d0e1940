/** Where to go after signing in when no (usable) `next` is given. */
export const defaultAfterSignIn = "/workspaces";

/**
 * Accepts a `?next=` value only if it is a path on this site, so a crafted link can never send a user
 * who just signed in to another origin (open-redirect protection, OWASP common practice).
 * @param next - raw query value (may be missing or repeated)
 * @returns a same-origin path starting with a single "/", or {@link defaultAfterSignIn}
 */
export function safeNextPath(next: string | string[] | undefined | null): string {
  const value = Array.isArray(next) ? next[0] : next;
  if (!value || !value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return defaultAfterSignIn;
  // Control characters (tabs, newlines) are stripped by URL parsers and could turn "/\t/evil" into "//evil".
  if (/[\u0000-\u001f\u007f]/.test(value)) return defaultAfterSignIn;
  const resolved = new URL(value, "http://same-origin.invalid");
  if (resolved.origin !== "http://same-origin.invalid") return defaultAfterSignIn;
  return `${resolved.pathname}${resolved.search}${resolved.hash}`;
}

/**
 * Builds a sign-in or sign-up link that returns to `next` afterwards.
 * @param page - "/sign-in" or "/sign-up"
 * @param next - a path on this site; omitted when it is the default destination
 */
export function authPageHref(page: "/sign-in" | "/sign-up", next: string): string {
  return next === defaultAfterSignIn ? page : `${page}?next=${encodeURIComponent(next)}`;
}
