"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { useDropzone } from "react-dropzone";
import { Button, Field, Notice, SelectField, TextField, cx } from "@/components/ui";
import { datasetMappingSchema, describeFileIssue, kKinds, parseDatasetMapping, previewDelimitedText, type FileIssue, type FilePreview, type KKind } from "@/lib/datasets";
import { energyUnits } from "@/lib/units";
import { draftToMapping, formColumnRoles, initialDraft, type FormColumnRole, type MappingDraft } from "./mapping-draft";

/** Bytes read in the browser for the preview; the server reads the whole file again. */
const PREVIEW_BYTES = 64 * 1024;
const PREVIEW_ROWS = 8;

const kKindLabels: Record<KKind, string> = {
  reduced: "Reduced coordinates (needs the lattice)",
  cartesian: "Cartesian, 1/Å (2π included)",
  twoPiOverA: "Units of 2π/a (needs a)",
  path: "Path distance (needs the path)",
};

type ServerRefusal = { message: string; issues: FileIssue[]; issueCount: number; existing?: { href: string } };

/** Field errors keyed by the form's own field names, from the mapping schema's dotted paths. */
function fieldOf(path: string): string {
  if (path.startsWith("k.lattice")) return "lattice";
  if (path.startsWith("k.path")) return "path";
  if (path === "k.latticeConstant") return "latticeConstant";
  if (path.startsWith("k.") || path.startsWith("energy") || path.startsWith("band") || path === "columns" || path.startsWith("sigma") || path.startsWith("weight") || path.startsWith("label")) return "columns";
  return path;
}

function groupErrors(fieldErrors: Record<string, string[]>): Record<string, string[]> {
  const grouped: Record<string, string[]> = {};
  for (const [path, messages] of Object.entries(fieldErrors)) (grouped[fieldOf(path)] ??= []).push(...messages);
  return grouped;
}

export function UploadForm({ slug, maxBytes, maxBytesLabel }: { slug: string; maxBytes: number; maxBytesLabel: string }) {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<FilePreview | null>(null);
  const [draft, setDraft] = useState<MappingDraft | null>(null);
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [refusal, setRefusal] = useState<ServerRefusal | null>(null);
  const [pending, setPending] = useState(false);

  const onDrop = async (accepted: File[]) => {
    const dropped = accepted[0];
    if (!dropped) return;
    setRefusal(null);
    setErrors({});
    setFile(dropped);
    const bytes = new Uint8Array(await dropped.slice(0, PREVIEW_BYTES).arrayBuffer());
    const read = await previewDelimitedText(bytes, { maxRows: PREVIEW_ROWS, truncated: dropped.size > PREVIEW_BYTES });
    setPreview(read);
    setDraft(read.ok ? initialDraft(dropped.name, read.header, read.guess.columns.map((c) => c.role), read.guess.suggestion) : null);
  };
  const dropzone = useDropzone({ onDrop, multiple: false, maxFiles: 1 });

  const update = (changes: Partial<MappingDraft>) => setDraft((d) => (d ? { ...d, ...changes } : d));
  const setRole = (index: number, role: FormColumnRole) => setDraft((d) => (d ? { ...d, roles: d.roles.map((r, i) => (i === index ? role : r)) } : d));

  const header = preview?.ok ? preview.header : [];
  const needsLattice = draft?.kKind === "reduced" || (draft?.pathCoordinates === "reduced" && draft.path.trim() !== "");

  async function onSubmit(event: FormEvent) {
    event.preventDefault();
    if (!file || !draft) return;
    setRefusal(null);
    const mapping = draftToMapping(draft, header);
    const checked = parseDatasetMapping(mapping);
    if (!checked.ok) {
      setErrors(groupErrors(checked.fieldErrors));
      return;
    }
    setErrors({});
    if (file.size > maxBytes) {
      setRefusal({ message: "The file is too large.", issues: [{ row: null, column: null, columnName: null, message: `the file is larger than the limit of ${maxBytesLabel}` }], issueCount: 1 });
      return;
    }
    setPending(true);
    try {
      const body = new FormData();
      body.append("file", file);
      body.append("mapping", JSON.stringify(datasetMappingSchema.parse(mapping)));
      const response = await fetch(`/api/workspaces/${encodeURIComponent(slug)}/datasets`, { method: "POST", body });
      const json = (await response.json().catch(() => null)) as
        | { id: string }
        | { error: { message: string; issues?: FileIssue[]; issueCount?: number; fieldErrors?: Record<string, string[]>; href?: string } }
        | null;
      if (response.status === 201 && json && "id" in json) {
        router.push(`/w/${slug}/datasets/${json.id}`);
        return;
      }
      const error = json && "error" in json ? json.error : { message: `The upload failed (HTTP ${response.status}).` };
      if (error.fieldErrors) setErrors(groupErrors(error.fieldErrors));
      setRefusal({
        message: error.message,
        issues: error.issues ?? [],
        issueCount: error.issueCount ?? error.issues?.length ?? 0,
        existing: error.href ? { href: error.href } : undefined,
      });
    } catch {
      setRefusal({ message: "The upload did not reach the server; check the connection and try again.", issues: [], issueCount: 0 });
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-6" noValidate>
      <div
        {...dropzone.getRootProps({
          className: cx(
            "flex cursor-pointer flex-col items-center gap-1 rounded-lg border-2 border-dashed px-6 py-8 text-center",
            dropzone.isDragActive ? "border-accent-600 bg-accent-50" : "border-line-strong bg-surface-raised",
          ),
        })}
      >
        <input {...dropzone.getInputProps({ "aria-label": "Band file (CSV or TSV)" })} />
        <p className="font-medium text-ink">{file ? file.name : "Drop a band file here, or click to choose one"}</p>
        <p className="text-sm text-ink-muted">
          CSV or TSV (comma, tab, semicolon or spaces), long or wide format, up to {maxBytesLabel}. Lines starting with # are skipped.
        </p>
      </div>

      {preview && !preview.ok ? (
        <Notice tone="error" title="This file cannot be read">
          {describeFileIssue(preview.issue)}
        </Notice>
      ) : null}

      {preview?.ok && draft ? (
        <>
          <section aria-labelledby="columns-heading" className="flex flex-col gap-2">
            <h2 id="columns-heading" className="text-base">
              Columns
            </h2>
            <p className="text-sm text-ink-muted">
              First rows as read in your browser (delimiter: {preview.delimiter === "\t" ? "tab" : preview.delimiter === "whitespace" ? "spaces" : `“${preview.delimiter}”`}). Say what each
              column holds; the guesses come from the header. Several “energy of one band” columns make a wide file.
            </p>
            {errors.columns ? (
              <p id="columns-error" className="text-sm font-medium text-danger-700">
                {errors.columns.join(" ")}
              </p>
            ) : null}
            <div className="overflow-x-auto rounded-lg border border-line">
              <table className="w-full border-collapse text-sm">
                <thead className="bg-surface-sunken">
                  <tr>
                    <th scope="col" className="px-2 py-1 text-left text-xs text-ink-muted">
                      Line
                    </th>
                    {preview.header.map((name, i) => (
                      <th key={`${name}-${i}`} scope="col" className="px-2 py-1 text-left align-top">
                        <label htmlFor={`role-${i}`} className="block font-mono text-xs text-ink">
                          {name}
                        </label>
                        <select
                          id={`role-${i}`}
                          value={draft.roles[i]}
                          onChange={(e) => setRole(i, e.target.value as FormColumnRole)}
                          className="mt-1 h-7 rounded-md border border-line-strong bg-surface px-1 text-sm font-normal"
                        >
                          {formColumnRoles.map((r) => (
                            <option key={r.value} value={r.value}>
                              {r.label}
                            </option>
                          ))}
                        </select>
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {preview.rows.map((row) => (
                    <tr key={row.row} className="border-t border-line">
                      <td className="px-2 py-1 tabular-nums text-ink-faint">{row.row}</td>
                      {preview.header.map((_, i) => (
                        <td key={i} className="whitespace-nowrap px-2 py-1 font-mono text-xs tabular-nums">
                          {row.fields[i] ?? ""}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </section>

          <section aria-labelledby="units-heading" className="grid gap-4 sm:grid-cols-2">
            <h2 id="units-heading" className="text-base sm:col-span-2">
              Units and k
            </h2>
            <SelectField
              name="energyUnit"
              label="Energy unit"
              value={draft.energyUnit}
              onChange={(e) => update({ energyUnit: e.target.value as MappingDraft["energyUnit"] })}
              options={energyUnits.map((u) => ({ value: u, label: u === "Ha" ? "Hartree (Ha)" : u }))}
              hint="Energies and σ are stored in eV (CODATA 2018 factors)."
            />
            <SelectField
              name="kKind"
              label="How k is given"
              value={draft.kKind}
              onChange={(e) => update({ kKind: e.target.value as KKind })}
              options={kKinds.map((k) => ({ value: k, label: kKindLabels[k] }))}
              hint="1D and 2D data name one or two k columns; the missing components are zero."
            />
            {needsLattice ? (
              <Field id="lattice" label="Lattice vectors (Å)" hint="One vector per line, three numbers: 2.7155 2.7155 0" errors={errors.lattice}>
                {(d) => (
                  <textarea
                    id={d.id}
                    aria-describedby={d.describedBy}
                    aria-invalid={d.invalid || undefined}
                    rows={3}
                    value={draft.lattice}
                    onChange={(e) => update({ lattice: e.target.value })}
                    className="rounded-md border border-line-strong bg-surface px-2.5 py-1.5 font-mono text-sm"
                  />
                )}
              </Field>
            ) : null}
            {draft.kKind === "twoPiOverA" ? (
              <TextField name="latticeConstant" label="Lattice constant a (Å)" inputMode="decimal" value={draft.latticeConstant} onChange={(e) => update({ latticeConstant: e.target.value })} errors={errors.latticeConstant} />
            ) : null}
            <Field
              id="path"
              label={draft.kKind === "path" ? "Path: labelled points" : "Labelled points for the axis"}
              optional={draft.kKind !== "path"}
              hint="One per line, label then coordinates: Γ 0 0 0 — in order along the path."
              errors={errors.path}
            >
              {(d) => (
                <textarea
                  id={d.id}
                  aria-describedby={d.describedBy}
                  aria-invalid={d.invalid || undefined}
                  rows={4}
                  value={draft.path}
                  onChange={(e) => update({ path: e.target.value })}
                  className="rounded-md border border-line-strong bg-surface px-2.5 py-1.5 font-mono text-sm"
                />
              )}
            </Field>
            <SelectField
              name="pathCoordinates"
              label="Labelled points are in"
              value={draft.pathCoordinates}
              onChange={(e) => update({ pathCoordinates: e.target.value as MappingDraft["pathCoordinates"] })}
              options={[
                { value: "reduced", label: "Reduced coordinates" },
                { value: "cartesian", label: "Cartesian, 1/Å" },
              ]}
            />
          </section>

          <section aria-labelledby="about-heading" className="grid gap-4 sm:grid-cols-2">
            <h2 id="about-heading" className="text-base sm:col-span-2">
              About the data
            </h2>
            <TextField name="name" label="Name" value={draft.name} onChange={(e) => update({ name: e.target.value })} errors={errors.name} maxLength={200} />
            <SelectField
              name="source"
              label="Source"
              value={draft.source}
              onChange={(e) => update({ source: e.target.value as MappingDraft["source"] })}
              options={[
                { value: "calculation", label: "Calculation (DFT, GW…)" },
                { value: "photoemission", label: "Photoemission (ARPES)" },
              ]}
            />
            <TextField
              name="energyReference"
              label="Energy reference"
              optional
              value={draft.energyReference}
              onChange={(e) => update({ energyReference: e.target.value })}
              hint="Where zero is: Fermi level, valence-band maximum…"
              errors={errors.energyReference}
            />
            <TextField name="description" label="Description" optional value={draft.description} onChange={(e) => update({ description: e.target.value })} errors={errors.description} />
          </section>

          {refusal ? (
            <Notice tone="error" title="The upload was refused; nothing was stored">
              <p>{refusal.message}</p>
              {refusal.existing ? (
                <p className="mt-1">
                  <Link href={refusal.existing.href} className="font-medium underline">
                    Open the existing dataset
                  </Link>
                </p>
              ) : null}
              {refusal.issues.length > 0 ? (
                <ul aria-label="Problems in the file" className="mt-2 list-disc pl-5">
                  {refusal.issues.map((issue, i) => (
                    <li key={i}>{describeFileIssue(issue)}</li>
                  ))}
                </ul>
              ) : null}
              {refusal.issueCount > refusal.issues.length ? <p className="mt-1">…and {refusal.issueCount - refusal.issues.length} more.</p> : null}
            </Notice>
          ) : null}

          <div>
            <Button type="submit" disabled={pending}>
              {pending ? "Uploading…" : "Upload dataset"}
            </Button>
          </div>
        </>
      ) : null}
    </form>
  );
}
