// npm run bench: runs every section in scripts/bench/*.ts (each exports `run(): Promise<Record<string, unknown>>`
// and prints its own lines), then prints one JSON object merging all sections' figures as the LAST line.
import { readdirSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

type Section = { run: () => Promise<Record<string, unknown>> };

const folder = join(dirname(fileURLToPath(import.meta.url)), "bench");
const figures: Record<string, unknown> = {};
for (const file of readdirSync(folder).filter((f) => f.endsWith(".ts")).sort()) {
  const section = (await import(pathToFileURL(join(folder, file)).href)) as Section;
  console.log(`— ${file}`);
  Object.assign(figures, await section.run());
}
console.log(JSON.stringify(figures));
