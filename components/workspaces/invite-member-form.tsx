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
      <div className="grid gap-3 md:grid-cols-[minmax(0,1fr)_minmax(0,20rem)_auto] md:items-start">
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
        <SelectField
          label="Role"
          id="invite-role"
          name="role"
          defaultValue="viewer"
          options={roleOptions}
          hint="You can change it later."
          errors={errorsFor("role")}
        />
        {/* Offset by the label's height so the button lines up with the inputs on wide screens. */}
        <div className="md:mt-6">
          <SubmitButton pending={pending} pendingLabel="Sending…">
            Send invitation
          </SubmitButton>
        </div>
      </div>
    </form>
  );
}
