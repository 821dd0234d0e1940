"use client";

import { z } from "zod";
import { workspaceRoleSchema } from "@/lib/schemas/workspaces";

const createdKeySchema = z.looseObject({ id: z.string(), key: z.string(), prefix: z.string(), label: z.string(), role: workspaceRoleSchema });
export type CreatedKey = z.infer<typeof createdKeySchema>;

const errorBodySchema = z.object({
  error: z.object({ message: z.string(), issues: z.record(z.string(), z.array(z.string())).optional() }),
});

/** A refused request: the route's safe message and, for refused input, messages per field. */
export class KeyRequestError extends Error {
  constructor(
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
  }
}

async function refusal(response: Response): Promise<KeyRequestError> {
  const parsed = errorBodySchema.safeParse(await response.json().catch(() => null));
  return parsed.success ? new KeyRequestError(parsed.data.error.message, parsed.data.error.issues) : new KeyRequestError(`The server answered ${response.status}.`);
}

const keysUrl = (slug: string) => `/api/workspaces/${encodeURIComponent(slug)}/api-keys`;

/** POST …/api-keys: the new key, whose text the answer carries this once. */
export async function requestNewKey(slug: string, body: { label: string; role: string }): Promise<CreatedKey> {
  const response = await fetch(keysUrl(slug), { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  if (!response.ok) throw await refusal(response);
  const parsed = createdKeySchema.safeParse(await response.json());
  if (!parsed.success) throw new KeyRequestError("The server's answer was not understood; reload the page.");
  return parsed.data;
}

/** DELETE …/api-keys/{id}. */
export async function requestRevocation(slug: string, keyId: string): Promise<void> {
  const response = await fetch(`${keysUrl(slug)}/${encodeURIComponent(keyId)}`, { method: "DELETE" });
  if (!response.ok) throw await refusal(response);
}
