"use client";

import type { FormEvent } from "react";
import { useActionForm } from "@/components/forms/use-action-form";
import { Select, SubmitButton } from "@/components/ui";
import type { WorkspaceRole } from "@/lib/auth/roles";
import { changeMemberRoleAction, removeMemberAction } from "@/lib/server/actions/workspaces";
import { shortRoleOptions } from "./role-options";

interface MemberActionsProps {
  slug: string;
  memberId: string;
  name: string;
  role: WorkspaceRole;
}

/** Owner-only controls in one member's row: change the role, remove from the workspace. */
export function MemberActions({ slug, memberId, name, role }: MemberActionsProps) {
  const changeRole = useActionForm(changeMemberRoleAction);
  const remove = useActionForm(removeMemberAction);
  const selectId = `role-${memberId}`;
  const problem = [changeRole.state, remove.state].find((s) => !s.ok && s.message);

  function confirmRemoval(event: FormEvent<HTMLFormElement>) {
    if (!window.confirm(`Remove ${name} from this workspace? They lose access at once.`)) {
      event.preventDefault();
      return;
    }
    remove.onSubmit(event);
  }

  return (
    <div className="flex flex-col items-end gap-1">
      <div className="flex items-center justify-end gap-2">
        <form onSubmit={changeRole.onSubmit} className="flex items-center gap-1.5">
          <input type="hidden" name="slug" value={slug} />
          <input type="hidden" name="memberId" value={memberId} />
          <label htmlFor={selectId} className="sr-only">
            Role of {name}
          </label>
          <Select id={selectId} name="role" defaultValue={role} density="compact" className="w-24">
            {shortRoleOptions.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </Select>
          <SubmitButton size="sm" variant="secondary" pending={changeRole.pending} pendingLabel="Saving…">
            <span>
              Save<span className="sr-only"> role of {name}</span>
            </span>
          </SubmitButton>
        </form>
        <form onSubmit={confirmRemoval}>
          <input type="hidden" name="slug" value={slug} />
          <input type="hidden" name="memberId" value={memberId} />
          <SubmitButton size="sm" variant="danger" pending={remove.pending} pendingLabel="Removing…">
            <span>
              Remove<span className="sr-only"> {name}</span>
            </span>
          </SubmitButton>
        </form>
      </div>
      {problem ? (
        <p role="alert" className="text-xs text-danger-700">
          {problem.message}
        </p>
      ) : null}
    </div>
  );
}
