import { z } from "zod";
import { workspaceRoleSchema } from "./workspaces";

/** Longest key label we store; longer labels are refused, not truncated. */
export const apiKeyLabelMaxLength = 100;

/** Body of POST /api/workspaces/{slug}/api-keys and the create-key form. */
export const createApiKeyInput = z.object({
  label: z
    .string({ error: "Name the key." })
    .trim()
    .min(1, { error: "Name the key, e.g. the notebook or script that will use it." })
    .max(apiKeyLabelMaxLength, { error: `The name must be at most ${apiKeyLabelMaxLength} characters.` }),
  role: workspaceRoleSchema,
});
export type CreateApiKeyInput = z.infer<typeof createApiKeyInput>;
