"use client";

import { useRouter } from "next/navigation";
import { type FormEvent, useState } from "react";
import { Button, Notice, SelectField, SubmitButton, TextField, roleDescriptions, roleLabels } from "@/components/ui";
import { type WorkspaceRole, hasRole, workspaceRoles } from "@/lib/auth/roles";
import { type CreatedKey, KeyRequestError, requestNewKey } from "./api-key-requests";

/** Shows a new key once, with a copy button; the key's text is not kept anywhere after "Done". */
function NewKeyNotice({ created, onDone }: { created: CreatedKey; onDone: () => void }) {
  const [copied, setCopied] = useState<"yes" | "failed" | null>(null);
  async function copy() {
    try {
      await navigator.clipboard.writeText(created.key);
      setCopied("yes");
    } catch {
      setCopied("failed");
    }
  }
  return (
    <Notice tone="success" title={`Key "${created.label}" created (${roleLabels[created.role]})`}>
      <p>Copy it now: it is shown only this once, and Bandwright keeps only a hash of it.</p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <label htmlFor="new-api-key" className="sr-only">
          The new API key
        </label>
        <input
          id="new-api-key"
          readOnly
          value={created.key}
          onFocus={(e) => e.currentTarget.select()}
          className="min-w-0 flex-1 basis-64 rounded-md border border-line-strong bg-surface px-2 py-1 font-mono text-sm text-ink"
        />
        <Button size="sm" variant="secondary" onClick={copy}>
          Copy key
        </Button>
        <Button size="sm" variant="ghost" onClick={onDone}>
          Done
        </Button>
      </div>
      <p aria-live="polite" className="mt-1 text-xs">
        {copied === "yes" ? "Copied to the clipboard." : copied === "failed" ? "The browser did not allow copying; select the key and copy it." : ""}
      </p>
    </Notice>
  );
}

/** Creates a key for the signed-in member, with a role no higher than their own. */
export function CreateKeyForm({ slug, ownRole }: { slug: string; ownRole: WorkspaceRole }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [problem, setProblem] = useState<KeyRequestError | null>(null);
  const [created, setCreated] = useState<CreatedKey | null>(null);
  const allowed = workspaceRoles.filter((role) => hasRole(ownRole, role));

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const fields = new FormData(form);
    setPending(true);
    setProblem(null);
    try {
      setCreated(await requestNewKey(slug, { label: String(fields.get("label") ?? ""), role: String(fields.get("role") ?? "") }));
      form.reset();
      router.refresh();
    } catch (error) {
      setProblem(error instanceof KeyRequestError ? error : new KeyRequestError("The key could not be created; try again."));
    } finally {
      setPending(false);
    }
  }

  return (
    <div className="flex flex-col gap-3">
      {created ? <NewKeyNotice created={created} onDone={() => setCreated(null)} /> : null}
      {problem ? <Notice tone="error">{problem.message}</Notice> : null}
      <form onSubmit={onSubmit} className="grid gap-3 md:grid-cols-[minmax(0,1fr)_minmax(0,20rem)_auto] md:items-start" aria-label="Create an API key">
        <TextField
          label="Name"
          id="api-key-label"
          name="label"
          required
          maxLength={100}
          autoComplete="off"
          placeholder="e.g. band-fits notebook"
          hint="Says which script or notebook uses the key."
          errors={problem?.fieldErrors.label}
        />
        <SelectField
          label="Role"
          id="api-key-role"
          name="role"
          defaultValue="viewer"
          options={allowed.map((role) => ({ value: role, label: `${roleLabels[role]} — ${roleDescriptions[role]}` }))}
          hint="At most your own role; if yours is lowered later, the key's is too."
          errors={problem?.fieldErrors.role}
        />
        <div className="md:mt-6">
          <SubmitButton pending={pending} pendingLabel="Creating…">
            Create key
          </SubmitButton>
        </div>
      </form>
    </div>
  );
}
