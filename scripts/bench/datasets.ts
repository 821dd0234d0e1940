// Dataset parsing speed, memory and event-loop blocking: a generated 500 000-point band file
// (tests/unit/datasets/large-file.ts, 19 MB) read into memory and streamed from a Blob through
// parseDispersionTable, as the upload route does, once without pauses (one long task, as the upload ran
// before) and once with the upload's pause between chunks; and a file whose header is one 20 MB line, which
// must be refused at once. Each run is a fresh child process, so its peak RSS is the parse's own (plus the
// file's bytes, Node and the module loader).
// "Event-loop delay" is the largest delay of a 10 ms timer during the parse (perf_hooks
// monitorEventLoopDelay): how long any other request would have waited.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { monitorEventLoopDelay } from "node:perf_hooks";
import { fileURLToPath, pathToFileURL } from "node:url";
import { datasetMappingSchema, parseDispersionTable } from "@/lib/datasets";
import { yieldToEventLoop } from "@/lib/server/yield-to-event-loop";
import { largeBandFile, largeFileMapping } from "@/tests/unit/datasets/large-file";

const RUNS = 3;
const CHILD_FLAG = "--parse-child";
const HEADER_BYTES = 20_000_000;

type Mode = "plain" | "paused";

interface ChildFigures {
  ms: number;
  peakMb: number;
  startMb: number;
  maxDelayMs: number;
  points: number;
  refusal: string | null;
}

/** In the child: parse the file once, print time, memory and the largest event-loop delay as JSON. */
async function parseOnce(file: string, mode: Mode): Promise<void> {
  const bytes = readFileSync(file);
  const delay = monitorEventLoopDelay({ resolution: 10 });
  delay.enable();
  // The histogram records from its second tick on: let it take a first sample before the parse.
  await new Promise((resolve) => setTimeout(resolve, 30));
  const startMb = process.memoryUsage().rss / 2 ** 20;
  const started = performance.now();
  const result = await parseDispersionTable(new Blob([bytes]).stream(), datasetMappingSchema.parse(largeFileMapping), {
    pause: mode === "paused" ? yieldToEventLoop : undefined,
  });
  const ms = performance.now() - started;
  // A parse that blocked shows only once the timer fires after it.
  await new Promise((resolve) => setTimeout(resolve, 30));
  delay.disable();
  const figures: ChildFigures = {
    ms,
    peakMb: process.resourceUsage().maxRSS / 1024,
    startMb,
    maxDelayMs: delay.max / 1e6,
    points: result.ok ? result.table.length : 0,
    refusal: result.ok ? null : (result.issues.at(-1)?.message ?? ""),
  };
  console.log(JSON.stringify(figures));
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const round = (x: number) => Math.round(x);

function runChildren(file: string, mode: Mode): ChildFigures {
  const runs: ChildFigures[] = [];
  for (let r = 0; r < RUNS; r++) {
    const child = spawnSync(process.execPath, ["--import", "tsx", fileURLToPath(import.meta.url), CHILD_FLAG, file, mode], {
      encoding: "utf8",
    });
    if (child.status !== 0) throw new Error(`parse child failed: ${child.stderr}`);
    runs.push(JSON.parse(child.stdout.trim().split("\n").at(-1) as string) as ChildFigures);
  }
  return {
    ms: round(median(runs.map((r) => r.ms))),
    peakMb: round(median(runs.map((r) => r.peakMb))),
    startMb: round(median(runs.map((r) => r.startMb))),
    maxDelayMs: round(median(runs.map((r) => r.maxDelayMs))),
    points: runs[0].points,
    refusal: runs[0].refusal,
  };
}

/** The large file's header, then one header cell after another up to 20 MB on the same line, then a row. */
function hugeHeaderFile(): string {
  const start = "cut,kx,ky,band,E_eV,dE_eV";
  const cells: string[] = [];
  for (let length = start.length, i = 0; length < HEADER_BYTES; i++) {
    const cell = `,extra_${i}`;
    cells.push(cell);
    length += cell.length;
  }
  return `${start}${cells.join("")}\nA,0,0,1,-1,0.01\n`;
}

export async function run(): Promise<Record<string, unknown>> {
  const folder = mkdtempSync(join(tmpdir(), "bandwright-bench-"));
  const large = join(folder, "large.csv");
  const header = join(folder, "huge-header.csv");
  try {
    writeFileSync(large, largeBandFile({ points: 500_000 }));
    writeFileSync(header, hugeHeaderFile());
    const plain = runChildren(large, "plain");
    const paused = runChildren(large, "paused");
    const refused = runChildren(header, "paused");
    if (refused.refusal === null) throw new Error("the 20 MB header was accepted");
    const points = plain.points.toLocaleString("en-US");
    console.log(
      `${points} points without pauses: parse ${plain.ms} ms (median of ${RUNS}), peak RSS ${plain.peakMb} MB ` +
        `(${plain.startMb} MB before the parse), event-loop delay up to ${plain.maxDelayMs} ms`,
    );
    console.log(`${points} points with the upload's pauses: parse ${paused.ms} ms, event-loop delay up to ${paused.maxDelayMs} ms`);
    console.log(
      `20 MB header line: refused in ${refused.ms} ms ("${refused.refusal}"), peak RSS ${refused.peakMb} MB, ` +
        `event-loop delay up to ${refused.maxDelayMs} ms`,
    );
    return {
      parse_500k_points_ms: plain.ms,
      parse_500k_points_peak_mb: plain.peakMb,
      parse_500k_points_max_loop_delay_ms: plain.maxDelayMs,
      parse_500k_points_paused_ms: paused.ms,
      parse_500k_points_paused_max_loop_delay_ms: paused.maxDelayMs,
      parse_20mb_header_refusal_ms: refused.ms,
      parse_20mb_header_peak_mb: refused.peakMb,
      parse_20mb_header_max_loop_delay_ms: refused.maxDelayMs,
    };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

if (process.argv[2] === CHILD_FLAG && import.meta.url === pathToFileURL(process.argv[1] ?? "").href)
  await parseOnce(process.argv[3], process.argv[4] as Mode);
