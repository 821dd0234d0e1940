import type { ActionState } from "@/lib/server/action-state";
import { Notice } from "@/components/ui";

/** The outcome of the last form submission; nothing before the first one. */
export function ActionMessage({ state }: { state: ActionState }) {
  if (!state.message) return null;
  const hasFieldErrors = Boolean(state.fieldErrors && Object.keys(state.fieldErrors).length > 0);
  return (
    <Notice tone={state.ok ? "success" : "error"}>
      {state.message}
      {hasFieldErrors ? " See the marked fields." : null}
    </Notice>
  );
}
