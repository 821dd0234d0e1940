"use client";

import { ActionMessage } from "@/components/forms/action-message";
import { useActionForm } from "@/components/forms/use-action-form";
import { SelectField, SubmitButton, TextField } from "@/components/ui";
import { inviteMemberAction } from "@/lib/server/actions/workspaces";
import { roleOptions } from "./role-options";

/** Owner-only: invites a colleague by e-mail with a role. */
export function InviteMemberForm({ slug }: { slug: string }) {
  const { state, pending, onSubmit, formRef, errorsFor } = useActionForm(inviteMemberAction);
  return (
    <form ref={formRef} onSubmit={onSubmit} className="flex flex-col gap-3" aria-label="Invite a member">
      <input type="hidden" name="slug" value={slug} />
      <ActionMessage state={state} />
      <TextField
        label="E-mail"
        id="invite-email"
        name="email"
        type="email"
        required
        autoComplete="off"
        placeholder="colleague@lab.example"
        hint="We e-mail an invitation link; it works for 7 days."
        errors={errorsFor("email")}
      />
      <SelectField label="Role" id="invite-role" name="role" defaultValue="viewer" options={roleOptions} errors={errorsFor("role")} />
      <div>
        <SubmitButton pending={pending} pendingLabel="Sending…">
          Send invitation
        </SubmitButton>
      </div>
    </form>
  );
}
