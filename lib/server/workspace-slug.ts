import { randomBytes } from "node:crypto";

/**
 * A URL-safe, unique-enough slug from a workspace name: lower-case ASCII words joined by "-", plus a
 * random suffix so two labs with the same name never collide (and slugs are not guessable from names).
 */
export function workspaceSlugFor(name: string): string {
  const base = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48)
    .replace(/-+$/g, "");
  const suffix = randomBytes(4).toString("hex");
  return base ? `${base}-${suffix}` : `workspace-${suffix}`;
}
