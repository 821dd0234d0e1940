// npm run fit -- --points POINTS.csv --model MODEL.json [--mapping MAPPING.json] [--options OPTIONS.json]
// Fits a model to band points without the server. Progress goes to stderr; the last stdout line is the
// result as one JSON object. Bad input: one line on stderr, exit code 2.
import { readFile } from "node:fs/promises";
import { parseArgs } from "node:util";
import { BandFitError, type BandFitResult, LeastSquaresError, runBandFit, validateBandFit } from "@/lib/fit";
import { type DatasetMappingInput, datasetMappingSchema, describeFileIssue, parseDispersionFile } from "@/lib/datasets";

const USAGE = "usage: npm run fit -- --points POINTS.csv --model MODEL.json [--mapping MAPPING.json] [--options OPTIONS.json]";

/** Input the user got wrong: reported on one line, exit code 2. */
class InputError extends Error {}

async function main(): Promise<void> {
  const args = readArguments();
  const points = await readPoints(args.points);
  const input = {
    points,
    model: await readJson(args.model, "--model"),
    mapping: args.mapping ? await readJson(args.mapping, "--mapping") : undefined,
    ...(await readOptionsFile(args.options)),
  };
  const validation = validateBandFit(input);
  if (!validation.ok) throw new InputError(validation.issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join("; "));
  const { selection } = validation.prepared;
  process.stderr.write(`fitting ${selection.kept.length} points at ${selection.kPoints.length} k-points\n`);
  const result = await runBandFit(validation.prepared, {
    onProgress: (p) =>
      process.stderr.write(`start ${p.start} iteration ${p.iteration}: χ² = ${p.chiSquared.toPrecision(6)}, λ = ${p.damping.toExponential(1)}\n`),
  });
  for (const w of result.warnings) process.stderr.write(`warning (${w.kind}): ${w.message}\n`);
  process.stdout.write(`${JSON.stringify(summaryLine(result))}\n`);
}

function readArguments() {
  let values;
  try {
    ({ values } = parseArgs({
      options: { points: { type: "string" }, model: { type: "string" }, mapping: { type: "string" }, options: { type: "string" } },
      strict: true,
      allowPositionals: false,
    }));
  } catch (error) {
    throw new InputError(`${(error as Error).message}; ${USAGE}`);
  }
  if (!values.points || !values.model) throw new InputError(`--points and --model are required; ${USAGE}`);
  return { points: values.points, model: values.model, mapping: values.mapping, options: values.options };
}

async function readText(path: string, flag: string): Promise<string> {
  try {
    return await readFile(path, "utf8");
  } catch (error) {
    throw new InputError(`${flag} ${path}: ${(error as NodeJS.ErrnoException).code === "ENOENT" ? "no such file" : (error as Error).message}`);
  }
}

async function readJson(path: string, flag: string): Promise<unknown> {
  const text = await readText(path, flag);
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new InputError(`${flag} ${path}: not valid JSON (${(error as Error).message})`);
  }
}

/** OPTIONS.json holds the fit options, and may also hold the energy window as `window`. */
async function readOptionsFile(path: string | undefined): Promise<{ options?: unknown; window?: unknown }> {
  if (!path) return {};
  const json = await readJson(path, "--options");
  if (json && typeof json === "object" && !Array.isArray(json) && "window" in json) {
    const { window, ...options } = json as Record<string, unknown>;
    return { options, window };
  }
  return { options: json };
}

/** Columns kx, ky, kz (Cartesian 1/Å), band, energy (eV) and optionally sigma (eV). */
async function readPoints(path: string) {
  const text = await readText(path, "--points");
  const header = (text.split(/\r?\n/, 1)[0] ?? "").split(",").map((c) => c.trim());
  const mapping: DatasetMappingInput = {
    name: path,
    source: "calculation",
    format: "long",
    delimiter: ",",
    k: { kind: "cartesian", columns: ["kx", "ky", "kz"] },
    band: { column: "band" },
    energy: { column: "energy", unit: "eV" },
    ...(header.includes("sigma") ? { sigma: { column: "sigma", unit: "eV" } } : {}),
  };
  const parsed = await parseDispersionFile(text, datasetMappingSchema.parse(mapping));
  if (!parsed.ok)
    throw new InputError(
      `--points ${path}: ${parsed.issues.slice(0, 3).map(describeFileIssue).join("; ")}${parsed.issueCount > 3 ? ` (${parsed.issueCount} problems)` : ""}`,
    );
  return parsed.points;
}

/** The result, with `parameters` keyed by name for scripts. */
function summaryLine(result: BandFitResult) {
  return {
    parameters: Object.fromEntries(
      result.parameters.map((p) => [p.name, { value: p.value, standardError: p.standardError, unit: p.unit, free: p.free, determined: p.determined }]),
    ),
    rms: result.rms,
    maxAbsResidual: result.maxAbsResidual,
    chiSquared: result.chiSquared,
    reducedChiSquared: result.reducedChiSquared,
    bands: result.bands.map(({ dataBand, modelBand, points, rms, maxAbs }) => ({ dataBand, modelBand, points, rms, maxAbs })),
    pointsUsed: result.pointsUsed,
    pointsDropped: result.pointsDropped,
    iterations: result.iterations,
    stopReason: result.stopReason,
    converged: result.converged,
    warnings: result.warnings,
    fitMs: result.fitMs,
    fittedModel: result.fittedModel,
  };
}

main().catch((error: unknown) => {
  const oneLine = (message: string) => message.replace(/\s*\n\s*/g, " ");
  if (error instanceof InputError || error instanceof BandFitError || error instanceof LeastSquaresError) {
    process.stderr.write(`fit: ${oneLine(error.message)}\n`);
    process.exit(2);
  }
  process.stderr.write(`fit: unexpected failure: ${oneLine(error instanceof Error ? (error.stack ?? error.message) : String(error))}\n`);
  process.exit(1);
});
