"use client";

import { ActionMessage } from "@/components/forms/action-message";
import { useActionForm } from "@/components/forms/use-action-form";
import { SubmitButton, TextField } from "@/components/ui";
import { createWorkspaceAction } from "@/lib/server/actions/workspaces";
import { workspaceNameMaxLength } from "@/lib/schemas/workspaces";

/** Creates a workspace; the action redirects to it on success. */
export function CreateWorkspaceForm() {
  const { state, pending, onSubmit, formRef, errorsFor } = useActionForm(createWorkspaceAction);
  return (
    <form ref={formRef} onSubmit={onSubmit} className="flex flex-col gap-3">
      <ActionMessage state={state} />
      <TextField
        label="Workspace name"
        name="name"
        required
        maxLength={workspaceNameMaxLength}
        placeholder="e.g. Kagome metals ARPES"
        hint={`Your lab, project or collaboration; up to ${workspaceNameMaxLength} characters. You become its owner.`}
        errors={errorsFor("name")}
      />
      <div>
        <SubmitButton pending={pending} pendingLabel="Creating…">
          Create workspace
        </SubmitButton>
      </div>
    </form>
  );
}
