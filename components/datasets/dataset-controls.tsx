"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button, Notice, TextField } from "@/components/ui";
import { datasetChangesSchema, datasetNameMaxLength } from "@/lib/schemas/datasets";

/** Rename and delete for owners and editors (the routes check the role again). */
export function DatasetControls({ slug, id, name, description }: { slug: string; id: string; name: string; description: string }) {
  const router = useRouter();
  const [editing, setEditing] = useState(false);
  const [values, setValues] = useState({ name, description });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const url = `/api/workspaces/${encodeURIComponent(slug)}/datasets/${id}`;

  async function save(event: FormEvent) {
    event.preventDefault();
    const parsed = datasetChangesSchema.safeParse(values);
    if (!parsed.success) {
      const fieldErrors: Record<string, string[]> = {};
      for (const issue of parsed.error.issues) (fieldErrors[String(issue.path[0] ?? "name")] ??= []).push(issue.message);
      setErrors(fieldErrors);
      return;
    }
    setPending(true);
    const response = await fetch(url, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify(parsed.data) });
    setPending(false);
    if (!response.ok) {
      const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
      setMessage(body?.error?.message ?? `Saving failed (HTTP ${response.status}).`);
      return;
    }
    setErrors({});
    setMessage(null);
    setEditing(false);
    router.refresh();
  }

  async function remove() {
    if (!window.confirm(`Delete “${name}” and all its points? Fits of this dataset lose their data.`)) return;
    setPending(true);
    const response = await fetch(url, { method: "DELETE" });
    setPending(false);
    if (response.status !== 204) {
      setMessage(`Deleting failed (HTTP ${response.status}).`);
      return;
    }
    router.push(`/w/${slug}/datasets`);
    router.refresh();
  }

  if (!editing)
    return (
      <div className="flex flex-col items-end gap-2">
        <div className="flex gap-2">
          <Button variant="secondary" size="sm" onClick={() => setEditing(true)}>
            Rename
          </Button>
          <Button variant="danger" size="sm" onClick={remove} disabled={pending}>
            Delete
          </Button>
        </div>
        {message ? <Notice tone="error">{message}</Notice> : null}
      </div>
    );

  return (
    <form onSubmit={save} className="flex w-full max-w-md flex-col gap-3" noValidate>
      <TextField name="name" label="Name" value={values.name} maxLength={datasetNameMaxLength} onChange={(e) => setValues({ ...values, name: e.target.value })} errors={errors.name} />
      <TextField name="description" label="Description" optional value={values.description} onChange={(e) => setValues({ ...values, description: e.target.value })} errors={errors.description} />
      {message ? <Notice tone="error">{message}</Notice> : null}
      <div className="flex gap-2">
        <Button type="submit" size="sm" disabled={pending}>
          {pending ? "Saving…" : "Save"}
        </Button>
        <Button variant="ghost" size="sm" onClick={() => setEditing(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
