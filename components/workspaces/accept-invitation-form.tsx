"use client";

import { ActionMessage } from "@/components/forms/action-message";
import { useActionForm } from "@/components/forms/use-action-form";
import { SubmitButton } from "@/components/ui";
import { acceptInvitationAction } from "@/lib/server/actions/workspaces";

/** Accepts an invitation; the action redirects into the workspace. */
export function AcceptInvitationForm({ invitationId }: { invitationId: string }) {
  const { state, pending, onSubmit, formRef } = useActionForm(acceptInvitationAction);
  return (
    <form ref={formRef} onSubmit={onSubmit} className="flex flex-col gap-3">
      <input type="hidden" name="invitationId" value={invitationId} />
      <ActionMessage state={state} />
      <div>
        <SubmitButton pending={pending} pendingLabel="Joining…">
          Accept and open the workspace
        </SubmitButton>
      </div>
    </form>
  );
}
