import "server-only";
import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import type { WorkspaceRole } from "@/lib/auth/roles";
import type { ActionState } from "./action-state";
import { toAppError } from "./errors";
import { parseInput } from "./parse-input";
import { authorizeWorkspace, requirePrincipal, type WorkspaceAccess } from "./workspace-access";
import type { Principal } from "./principal";

type FormAction = (previous: ActionState, formData: FormData) => Promise<ActionState>;

// React adds its own "$ACTION_…" fields to submitted forms; they are not input.
function formFields(formData: FormData): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (!key.startsWith("$ACTION") && typeof value === "string") fields[key] = value;
  }
  return fields;
}

function failure(thrown: unknown): ActionState {
  // redirect() and notFound() work by throwing; let Next handle them.
  unstable_rethrow(thrown);
  const error = toAppError(thrown);
  return { ok: false, message: error.message, ...(error.issues ? { fieldErrors: error.issues } : {}) };
}

/** A form action for a signed-in user outside any workspace. */
export function userAction<S extends z.ZodType>(
  options: { input: S },
  handler: (context: { principal: Principal; input: z.output<S> }) => Promise<ActionState>,
): FormAction {
  return async (_previous, formData) => {
    try {
      const principal = await requirePrincipal();
      const input = parseInput(options.input, formFields(formData));
      return await handler({ principal, input });
    } catch (thrown) {
      return failure(thrown);
    }
  };
}

/**
 * A form action inside a workspace: the form carries a `slug` field; the same membership and role rule
 * as pages and route handlers applies before the input is parsed.
 */
export function workspaceAction<S extends z.ZodType>(
  options: { input: S; minimumRole: WorkspaceRole },
  handler: (context: { access: WorkspaceAccess; input: z.output<S> }) => Promise<ActionState>,
): FormAction {
  return async (_previous, formData) => {
    try {
      const principal = await requirePrincipal();
      const { slug = "", ...fields } = formFields(formData);
      const access = await authorizeWorkspace(principal, slug, options.minimumRole);
      const input = parseInput(options.input, fields);
      return await handler({ access, input });
    } catch (thrown) {
      return failure(thrown);
    }
  };
}
