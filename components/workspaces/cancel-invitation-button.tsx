"use client";

import { useActionForm } from "@/components/forms/use-action-form";
import { SubmitButton } from "@/components/ui";
import { cancelInvitationAction } from "@/lib/server/actions/workspaces";

/** Owner-only: withdraws one pending invitation (its link stops working, the address can be invited again). */
export function CancelInvitationButton({ slug, invitationId, email }: { slug: string; invitationId: string; email: string }) {
  const cancel = useActionForm(cancelInvitationAction);
  return (
    <div className="flex flex-col items-end gap-1">
      <form onSubmit={cancel.onSubmit}>
        <input type="hidden" name="slug" value={slug} />
        <input type="hidden" name="invitationId" value={invitationId} />
        <SubmitButton size="sm" variant="secondary" pending={cancel.pending} pendingLabel="Withdrawing…">
          <span>
            Withdraw<span className="sr-only"> the invitation to {email}</span>
          </span>
        </SubmitButton>
      </form>
      {!cancel.state.ok && cancel.state.message ? (
        <p role="alert" className="text-xs text-danger-700">
          {cancel.state.message}
        </p>
      ) : null}
    </div>
  );
}
