// Dataset parsing speed and memory: a generated 500 000-point band file (tests/unit/datasets/large-file.ts,
// 19 MB) streamed from disk through parseDispersionTable, the entry point the upload route uses. Each run
// is a fresh child process, so its peak RSS is the parse's own (plus Node and the module loader).
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { createReadStream } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { datasetMappingSchema, parseDispersionTable } from "@/lib/datasets";
import { largeBandFile, largeFileMapping } from "@/tests/unit/datasets/large-file";

const RUNS = 3;
const CHILD_FLAG = "--parse-child";

interface ChildFigures {
  ms: number;
  peakMb: number;
  startMb: number;
  points: number;
}

/** In the child: parse the file once, print time and memory as JSON. */
async function parseOnce(file: string): Promise<void> {
  const startMb = process.memoryUsage().rss / 2 ** 20;
  const started = performance.now();
  const result = await parseDispersionTable(createReadStream(file), datasetMappingSchema.parse(largeFileMapping));
  const ms = performance.now() - started;
  if (!result.ok) throw new Error(`the generated file was refused: ${JSON.stringify(result.issues.slice(0, 3))}`);
  const figures: ChildFigures = { ms, peakMb: process.resourceUsage().maxRSS / 1024, startMb, points: result.table.length };
  console.log(JSON.stringify(figures));
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const round = (x: number) => Math.round(x);

export async function run(): Promise<Record<string, unknown>> {
  const folder = mkdtempSync(join(tmpdir(), "bandwright-bench-"));
  const file = join(folder, "large.csv");
  try {
    writeFileSync(file, largeBandFile({ points: 500_000 }));
    const runs: ChildFigures[] = [];
    for (let r = 0; r < RUNS; r++) {
      const child = spawnSync(process.execPath, ["--import", "tsx", fileURLToPath(import.meta.url), CHILD_FLAG, file], {
        encoding: "utf8",
      });
      if (child.status !== 0) throw new Error(`parse child failed: ${child.stderr}`);
      runs.push(JSON.parse(child.stdout.trim().split("\n").at(-1) as string) as ChildFigures);
    }
    const ms = round(median(runs.map((r) => r.ms)));
    const peakMb = round(median(runs.map((r) => r.peakMb)));
    const startMb = round(median(runs.map((r) => r.startMb)));
    console.log(
      `${runs[0].points.toLocaleString("en-US")} points: parse ${ms} ms (median of ${RUNS}), peak RSS ${peakMb} MB (${startMb} MB before the parse)`,
    );
    return { parse_500k_points_ms: ms, parse_500k_points_peak_mb: peakMb };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

if (process.argv[2] === CHILD_FLAG && import.meta.url === pathToFileURL(process.argv[1] ?? "").href) await parseOnce(process.argv[3]);
