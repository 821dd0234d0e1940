import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { readStoredResult } from "@/lib/fit/bands";
import { buildTemplate } from "@/lib/tb";
import { type LaunchDraft, defaultLaunchOptions, draftFromRevision, parameterDrafts, readLaunchDraft } from "@/lib/views/launch-draft";
import { revisionDetailsSchema } from "@/lib/views/responses";
import { readNumber } from "@/lib/views/number-field";

function draft(change: (d: LaunchDraft) => void = () => {}): LaunchDraft {
  const d: LaunchDraft = {
    name: "Graphene π bands",
    datasetId: "ds_1",
    source: { kind: "template", template: "honeycomb-pz", latticeConstant: "2.46" },
    parameters: parameterDrafts(buildTemplate("honeycomb-pz").parameters),
    mapping: { kind: "offset", firstDataBand: "", lastDataBand: "", firstModelBand: "1" },
    window: { min: "-9", max: "5" },
    options: { ...defaultLaunchOptions, bandWeights: {} },
  };
  change(d);
  return d;
}

describe("readNumber", () => {
  it("reads decimals, exponents and the true minus sign", () => {
    expect(readNumber(" \u22122.781 ")).toEqual({ kind: "number", value: -2.781 });
    expect(readNumber("1e-3")).toEqual({ kind: "number", value: 0.001 });
    expect(readNumber("")).toEqual({ kind: "empty" });
  });

  it("refuses text that is not a number", () => {
    for (const text of ["abc", "1,5", "2.5eV", "NaN", "Infinity", "--1"]) expect(readNumber(text).kind).toBe("invalid");
  });
});

describe("readLaunchDraft", () => {
  it("builds the launch request of issue 5 from a valid form", () => {
    const reading = readLaunchDraft(draft());
    expect(reading.ok).toBe(true);
    if (!reading.ok) return;
    expect(reading.request.model).toMatchObject({ template: "honeycomb-pz", latticeConstant: 2.46 });
    expect(reading.request.window).toEqual({ min: -9, max: 5 });
    expect(reading.request.options).toMatchObject({ timeLimitMs: 60_000, maxIterations: 200 });
    expect(reading.request.mapping).toEqual({ kind: "offset", dataBands: undefined, firstModelBand: 1 });
  });

  it("puts a non-numeric parameter value beside that parameter", () => {
    const d = draft((x) => (x.parameters[0].value = "abc"));
    const reading = readLaunchDraft(d);
    expect(reading.ok).toBe(false);
    if (reading.ok) return;
    expect(reading.errors[`parameters.${d.parameters[0].name}.value`]).toEqual(["enter a number, e.g. −2.5 or 1e-3"]);
  });

  it("reports min above max at the parameter's max", () => {
    const d = draft((x) => Object.assign(x.parameters[1], { min: "1", max: "-1" }));
    const reading = readLaunchDraft(d);
    expect(reading.ok ? {} : reading.errors).toEqual({ [`parameters.${d.parameters[1].name}.max`]: ["max must not be below min"] });
  });

  it("reports an empty energy window with the schema's own message at its max", () => {
    const reading = readLaunchDraft(draft((x) => (x.window = { min: "2", max: "2" })));
    // Message from energyWindowSchema (lib/fit/bands/schema.ts), the route's schema.
    expect(reading.ok ? {} : reading.errors).toEqual({ "window.max": ["the window's min must be below its max (eV)"] });
  });

  it("asks for both ends of a half-given window", () => {
    const reading = readLaunchDraft(draft((x) => (x.window = { min: "-3", max: "" })));
    expect(reading.ok ? {} : reading.errors).toEqual({ "window.max": ["give both ends of the window, or neither"] });
  });

  it("collects every problem at once, including the schema's bounds on options", () => {
    const reading = readLaunchDraft(
      draft((x) => {
        x.name = " ";
        x.options.starts = "0";
        x.options.maxIterations = "2.5";
        x.source = { kind: "template", template: "honeycomb-pz", latticeConstant: "-1" };
      }),
    );
    expect(reading.ok).toBe(false);
    if (reading.ok) return;
    expect(Object.keys(reading.errors).sort()).toEqual(["latticeConstant", "name", "options.maxIterations", "options.starts"]);
    expect(reading.errors["options.maxIterations"]).toEqual(["enter a whole number"]);
  });

  it("reports schema problems once the numbers read, beside their fields", () => {
    const reading = readLaunchDraft(
      draft((x) => {
        x.name = " ";
        x.options.starts = "0";
        x.source = { kind: "template", template: "honeycomb-pz", latticeConstant: "-1" };
      }),
    );
    expect(reading.ok).toBe(false);
    if (reading.ok) return;
    expect(reading.errors.name).toEqual(["give the fit a name"]);
    expect(reading.errors["options.starts"]).toHaveLength(1);
    expect(reading.errors.latticeConstant).toEqual(["the lattice constant must be positive (Å)"]);
  });

  it("keeps an earlier revision's model document with the edited parameters", () => {
    const document = buildTemplate("chain-s");
    const d = draft((x) => {
      x.source = { kind: "document", document };
      x.parameters = parameterDrafts(document.parameters);
      x.parameters[0].free = !document.parameters[0].free;
    });
    const reading = readLaunchDraft(d);
    expect(reading.ok).toBe(true);
    if (!reading.ok || !("format" in reading.request.model)) throw new Error("expected a model document");
    expect(reading.request.model.parameters[0].free).toBe(!document.parameters[0].free);
    expect(reading.request.model.sites).toEqual(document.sites);
  });
});

describe("draftFromRevision", () => {
  // A revision stored before bond integrals were spelled V_ppπ[Si–Si,1] (tests/support, made with f0e7d08),
  // as the revision route serves it: inputs and result read with today's names.
  const legacy = JSON.parse(readFileSync("tests/support/legacy-spelling-revision.json", "utf8"));
  const served = {
    number: 1,
    parentNumber: null,
    status: "succeeded",
    progress: null,
    fitName: "Halvorsen Si sample 7",
    failureReason: null,
    launchWarnings: [],
    launchedBy: "Jonas Brekkestad",
    createdAt: "2031-03-01T10:00:00.000Z",
    startedAt: "2031-03-01T10:00:01.000Z",
    finishedAt: "2031-03-01T10:00:02.000Z",
    inputs: legacy.inputs,
    result: readStoredResult(legacy.result),
  };

  it("pre-fills the form of a new revision from an old-spelling revision, with today's names, and the form reads", () => {
    const revision = revisionDetailsSchema.parse(served);
    const d = draftFromRevision(revision, "next");
    expect(d.parameters.map((p) => p.name)).toContain("V_ppπ[Si–Si,1]");
    const fitted = legacy.result.parameters.find((p: { name: string }) => p.name === "V_pp_pi[Si-Si,1]").value;
    expect(Number(d.parameters.find((p) => p.name === "V_ppπ[Si–Si,1]")!.value)).toBe(fitted);
    const reading = readLaunchDraft(d);
    expect(reading.ok).toBe(true);
  });
});
