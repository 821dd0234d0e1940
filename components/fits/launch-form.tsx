"use client";

import { useMutation, useQuery } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useDeferredValue, useMemo, useState } from "react";
import { Button, Notice, Panel, SelectField, TextField } from "@/components/ui";
import { NEUTRAL_ALIGNMENT } from "@/lib/fit/bands/energy-alignment";
import { DEFAULT_BAND_MAPPING, bandMappingSchema, fitOptionsSchema, modelSpecSchema, resolveModelSpec } from "@/lib/fit/bands/schema";
import { TEMPLATE_IDS, type TemplateId, buildTemplate } from "@/lib/tb";
import { dataBandStyles } from "@/lib/views/band-colours";
import { bandPairs } from "@/lib/views/band-mapping";
import { type LaunchDraft, defaultLaunchOptions, parameterDrafts, readLaunchDraft } from "@/lib/views/launch-draft";
import { RouteError, fitApi } from "./api";
import { useDatasetPoints } from "./hooks";
import { MappingPicture } from "./mapping-picture";
import { OverlayPanel } from "./overlay-panel";
import { ParameterEditor } from "./parameter-editor";

function templateDraft(template: TemplateId, datasetId: string, name: string): LaunchDraft {
  const doc = buildTemplate(template);
  return {
    name,
    datasetId,
    source: { kind: "template", template, latticeConstant: "" },
    parameters: parameterDrafts(doc.parameters),
    mapping: { kind: "offset", firstDataBand: "", lastDataBand: "", firstModelBand: "1" },
    window: { min: "", max: "" },
    options: defaultLaunchOptions,
  };
}

function templateLatticeHint(template: { latticeConstant: { value: number; meaning: string } } | undefined): string {
  if (!template) return "Empty: the template's own value.";
  return `${template.latticeConstant.meaning}; empty: ${template.latticeConstant.value.toFixed(4)} Å`;
}

interface LaunchFormProps {
  slug: string;
  /** a new fit (pick dataset and template), or a new revision of a fit from revision `from` */
  mode: { kind: "new-fit"; datasetId?: string } | { kind: "new-revision"; fitId: string; from: number; initial: LaunchDraft };
}

/**
 * The launch form: dataset and model, parameters, band mapping, window, σ and weights, limits, starts and
 * e-mail; a preview of the model's bands over the data, computed in the browser. Every problem shows
 * beside its field and nothing is sent while one remains.
 */
export function LaunchForm({ slug, mode }: LaunchFormProps) {
  const router = useRouter();
  const templates = useQuery({ queryKey: ["templates"], queryFn: fitApi.listTemplates, staleTime: Infinity, enabled: mode.kind === "new-fit" });
  const datasets = useQuery({ queryKey: ["datasets", slug], queryFn: () => fitApi.listDatasets(slug), enabled: mode.kind === "new-fit" });
  const [draft, setDraft] = useState<LaunchDraft>(() =>
    mode.kind === "new-revision" ? mode.initial : templateDraft("honeycomb-pz", mode.datasetId ?? "", ""),
  );
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [serverError, setServerError] = useState<string | null>(null);
  const errorsFor = (field: string) => errors[field];
  const data = useDatasetPoints(slug, draft.datasetId || undefined);

  const launch = useMutation({
    mutationFn: async (request: ReturnType<typeof readLaunchDraft>) => {
      if (!request.ok) throw new Error("unreachable: the form is checked before sending");
      if (mode.kind === "new-fit") {
        const created = await fitApi.launch(slug, request.request);
        return `/w/${slug}/fits/${created.fitId}/revisions/${created.revision}`;
      }
      const { model, mapping, window, options } = request.request;
      const created = await fitApi.newRevision(slug, mode.fitId, { from: mode.from, model, mapping, window: window ?? null, options });
      return `/w/${slug}/fits/${mode.fitId}/revisions/${created.revision}`;
    },
    onSuccess: (href) => router.push(href),
    onError: (error) => {
      setServerError(error.message);
      if (error instanceof RouteError) setErrors(error.issues);
    },
  });

  // The preview follows the form a render behind, so typing stays quick on big datasets.
  const deferred = useDeferredValue(draft);
  const reading = useMemo(() => readLaunchDraft({ ...deferred, name: deferred.name || "preview", datasetId: deferred.datasetId || "preview" }), [deferred]);
  const preview = useMemo(() => {
    if (!reading.ok) return { model: null, error: "Fix the marked fields to update the preview." };
    try {
      return { model: resolveModelSpec(modelSpecSchema.parse(reading.request.model)), error: null };
    } catch (error) {
      return { model: null, error: (error as Error).message };
    }
  }, [reading]);
  const previewMapping = reading.ok ? bandMappingSchema.parse(reading.request.mapping ?? DEFAULT_BAND_MAPPING) : DEFAULT_BAND_MAPPING;
  const previewOptions = fitOptionsSchema.safeParse(reading.ok ? reading.request.options : {});
  const previewAlignment = previewOptions.success
    ? { offset: previewOptions.data.energyOffset.value, renormalisation: previewOptions.data.renormalisation.value, reference: previewOptions.data.renormalisation.reference }
    : NEUTRAL_ALIGNMENT;

  const bands = data.dataset?.summary.bands ?? [];
  // The number of model bands depends on the sites and orbitals only, not on the values being edited.
  const modelBandCount = useMemo(() => {
    const sites = draft.source.kind === "template" ? buildTemplate(draft.source.template).sites : draft.source.document.sites;
    return sites.reduce((n, s) => n + s.orbitals.length, 0);
  }, [draft.source]);
  const pairs = bandPairs(previewMapping, bands, modelBandCount);
  const styles = dataBandStyles(bands);
  const window = reading.ok ? reading.request.window ?? null : null;

  const set = <K extends keyof LaunchDraft>(key: K, value: LaunchDraft[K]) => setDraft((d) => ({ ...d, [key]: value }));
  const setOption = <K extends keyof LaunchDraft["options"]>(key: K, value: LaunchDraft["options"][K]) => setDraft((d) => ({ ...d, options: { ...d.options, [key]: value } }));

  const submit = (event: React.FormEvent) => {
    event.preventDefault();
    setServerError(null);
    const result = readLaunchDraft(draft);
    if (!result.ok) {
      setErrors(result.errors);
      return;
    }
    setErrors({});
    launch.mutate(result);
  };

  const templateOptions = (templates.data?.templates ?? []).map((t) => ({ value: t.id, label: `${t.title} (${t.orbitals} orbital${t.orbitals === 1 ? "" : "s"})` }));
  const errorCount = Object.keys(errors).length;

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-6" aria-describedby={errorCount ? "form-errors" : undefined}>
      {errorCount ? (
        <Notice tone="error" title="Nothing was sent">
          <span id="form-errors">{errorCount === 1 ? "One field needs attention; it is marked below." : `${errorCount} fields need attention; they are marked below.`}</span>
        </Notice>
      ) : null}
      {serverError && !errorCount ? <Notice tone="error">{serverError}</Notice> : null}

      <Panel title="Data and model">
        <div className="grid gap-4 md:grid-cols-3">
          {mode.kind === "new-fit" ? (
            <>
              <TextField name="name" label="Fit name" hint="e.g. graphene π bands, 3rd neighbours" value={draft.name} onChange={(e) => set("name", e.target.value)} errors={errorsFor("name")} />
              <SelectField
                name="datasetId"
                label="Dataset"
                value={draft.datasetId}
                onChange={(e) => set("datasetId", e.target.value)}
                errors={errorsFor("datasetId")}
                hint={datasets.data?.datasets.length === 0 ? "Upload a dataset first." : undefined}
                options={[{ value: "", label: "Choose a dataset…" }, ...(datasets.data?.datasets ?? []).map((d) => ({ value: d.id, label: `${d.name} (${d.pointCount} points, ${d.bandCount} bands)` }))]}
              />
              <SelectField
                name="template"
                label="Model template"
                value={draft.source.kind === "template" ? draft.source.template : ""}
                onChange={(e) => {
                  const template = TEMPLATE_IDS.find((t) => t === e.target.value);
                  if (template) setDraft((d) => ({ ...templateDraft(template, d.datasetId, d.name), mapping: d.mapping, window: d.window, options: d.options }));
                }}
                options={templateOptions.length ? templateOptions : [{ value: draft.source.kind === "template" ? draft.source.template : "", label: "Loading templates…" }]}
              />
              {draft.source.kind === "template" ? (
                <TextField
                  name="latticeConstant"
                  label="Lattice constant (Å)"
                  optional
                  inputMode="decimal"
                  hint={templateLatticeHint(templates.data?.templates.find((t) => t.id === (draft.source.kind === "template" ? draft.source.template : "")))}
                  value={draft.source.latticeConstant}
                  onChange={(e) => set("source", { ...draft.source, latticeConstant: e.target.value } as LaunchDraft["source"])}
                  errors={errorsFor("latticeConstant")}
                />
              ) : null}
            </>
          ) : (
            <p className="text-sm md:col-span-3">
              Starting from revision {mode.from}: its model with the fitted values as start values, on the same dataset. Change what you want to try.
            </p>
          )}
        </div>
        {errorsFor("model") ? <p className="mt-2 text-xs font-medium text-danger-700">{errorsFor("model")!.join(" ")}</p> : null}
      </Panel>

      <Panel title="Preview over the data" description="The model's bands at the start values on the data's own k-points, computed in your browser. The shaded band is the energy window.">
        {!draft.datasetId ? (
          <p className="text-sm text-ink-muted">Choose a dataset to see the preview.</p>
        ) : data.dataset && data.points ? (
          preview.model ? (
            <OverlayPanel
              dataset={data.dataset}
              points={data.points}
              models={[{ key: "preview", label: "model", model: preview.model, alignment: previewAlignment }]}
              mapping={previewMapping}
              window={window}
              showResiduals={false}
            />
          ) : (
            <p className="text-sm text-ink-muted">{preview.error}</p>
          )
        ) : (
          <p className="text-sm text-ink-muted">Loading the data…</p>
        )}
      </Panel>

      <Panel title="Parameters" description="Start values, which to fit, and optional bounds (bounds keep a parameter inside a physical range)." flush>
        <ParameterEditor rows={draft.parameters} onChange={(rows) => set("parameters", rows)} errorsFor={errorsFor} />
      </Panel>

      <div className="grid gap-6 lg:grid-cols-2">
        <Panel title="Band mapping">
          <div className="flex flex-col gap-4">
            <SelectField
              name="mappingKind"
              label="How data bands meet model bands"
              value={draft.mapping.kind}
              onChange={(e) => set("mapping", { ...draft.mapping, kind: e.target.value === "nearest" ? "nearest" : "offset" })}
              options={[
                { value: "offset", label: "a contiguous range, from a first model band" },
                { value: "nearest", label: "nearest model band per point (photoemission branches)" },
              ]}
            />
            {draft.mapping.kind === "offset" ? (
              <div className="grid grid-cols-3 gap-3">
                <TextField name="mapping.firstDataBand" label="First data band" optional inputMode="numeric" value={draft.mapping.firstDataBand} onChange={(e) => set("mapping", { ...draft.mapping, firstDataBand: e.target.value })} errors={errorsFor("mapping.firstDataBand")} />
                <TextField name="mapping.lastDataBand" label="Last data band" optional inputMode="numeric" value={draft.mapping.lastDataBand} onChange={(e) => set("mapping", { ...draft.mapping, lastDataBand: e.target.value })} errors={errorsFor("mapping.lastDataBand")} />
                <TextField name="mapping.firstModelBand" label="First model band" inputMode="numeric" value={draft.mapping.firstModelBand} onChange={(e) => set("mapping", { ...draft.mapping, firstModelBand: e.target.value })} errors={errorsFor("mapping.firstModelBand")} />
              </div>
            ) : null}
            {bands.length ? <MappingPicture pairs={pairs} styles={styles} /> : null}
          </div>
        </Panel>
        <Panel title="Energy window, σ and weights">
          <div className="flex flex-col gap-4">
            <div className="grid grid-cols-2 gap-3">
              <TextField name="window.min" label="Window from (eV)" optional inputMode="decimal" hint="Points outside are left out." value={draft.window.min} onChange={(e) => set("window", { ...draft.window, min: e.target.value })} errors={errorsFor("window.min")} />
              <TextField name="window.max" label="Window to (eV)" optional inputMode="decimal" value={draft.window.max} onChange={(e) => set("window", { ...draft.window, max: e.target.value })} errors={errorsFor("window.max")} />
            </div>
            <div className="grid grid-cols-2 gap-3">
              <SelectField
                name="options.sigma"
                label="σ of each point"
                value={draft.options.sigma}
                onChange={(e) => setOption("sigma", e.target.value === "uniform" ? "uniform" : "from-data")}
                options={[
                  { value: "from-data", label: "from the data, else the default" },
                  { value: "uniform", label: "the default for every point" },
                ]}
              />
              <TextField name="options.uniformSigma" label="Default σ (eV)" inputMode="decimal" value={draft.options.uniformSigma} onChange={(e) => setOption("uniformSigma", e.target.value)} errors={errorsFor("options.uniformSigma")} />
            </div>
            {bands.length ? (
              <fieldset>
                <legend className="text-sm font-medium">Band weights</legend>
                <p className="text-xs text-ink-muted">1 = normal, 0 = left out; a weight w makes a point count as if σ were σ/√w.</p>
                <div className="mt-2 flex flex-wrap gap-3">
                  {bands.map((b) => (
                    <TextField
                      key={b}
                      name={`options.bandWeights.${b}`}
                      label={`Band ${b}`}
                      className="w-20"
                      inputMode="decimal"
                      placeholder="1"
                      value={draft.options.bandWeights[String(b)] ?? ""}
                      onChange={(e) => setOption("bandWeights", { ...draft.options.bandWeights, [String(b)]: e.target.value })}
                      errors={errorsFor(`options.bandWeights.${b}`)}
                    />
                  ))}
                </div>
              </fieldset>
            ) : null}
          </div>
        </Panel>
      </div>

      <Panel title="Run">
        <div className="grid gap-4 md:grid-cols-4">
          <TextField name="options.maxIterations" label="Iterations per start" inputMode="numeric" value={draft.options.maxIterations} onChange={(e) => setOption("maxIterations", e.target.value)} errors={errorsFor("options.maxIterations")} />
          <TextField name="options.timeLimitSeconds" label="Time limit (s)" inputMode="decimal" value={draft.options.timeLimitSeconds} onChange={(e) => setOption("timeLimitSeconds", e.target.value)} errors={errorsFor("options.timeLimitSeconds")} />
          <TextField name="options.starts" label="Starts" hint="More starts, drawn within the bounds, guard against a local minimum." inputMode="numeric" value={draft.options.starts} onChange={(e) => setOption("starts", e.target.value)} errors={errorsFor("options.starts")} />
          <TextField name="options.seed" label="Seed of the extra starts" inputMode="numeric" value={draft.options.seed} onChange={(e) => setOption("seed", e.target.value)} errors={errorsFor("options.seed")} />
          <TextField name="options.offsetValue" label="Energy offset δ (eV)" inputMode="decimal" value={draft.options.offsetValue} onChange={(e) => setOption("offsetValue", e.target.value)} errors={errorsFor("options.offsetValue")} />
          <label className="flex items-center gap-2 self-end pb-2 text-sm">
            <input type="checkbox" className="accent-accent-700" checked={draft.options.offsetFree} onChange={(e) => setOption("offsetFree", e.target.checked)} />
            Fit the offset
          </label>
          <TextField name="options.renormalisationValue" label="Renormalisation Z" inputMode="decimal" value={draft.options.renormalisationValue} onChange={(e) => setOption("renormalisationValue", e.target.value)} errors={errorsFor("options.renormalisationValue")} />
          <label className="flex items-center gap-2 self-end pb-2 text-sm">
            <input type="checkbox" className="accent-accent-700" checked={draft.options.renormalisationFree} onChange={(e) => setOption("renormalisationFree", e.target.checked)} />
            Fit Z
          </label>
        </div>
        <label className="mt-4 flex items-center gap-2 text-sm">
          <input type="checkbox" className="accent-accent-700" checked={draft.options.notifyByEmail} onChange={(e) => setOption("notifyByEmail", e.target.checked)} />
          E-mail me when the fit ends
        </label>
      </Panel>

      <div className="flex justify-end gap-2">
        <Button type="submit" disabled={launch.isPending}>
          {launch.isPending ? "Launching…" : mode.kind === "new-fit" ? "Launch fit" : "Launch revision"}
        </Button>
      </div>
    </form>
  );
}
