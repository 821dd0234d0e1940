import { readFileSync } from "node:fs";
import { z } from "zod";

// Reads vitest's JSON report and prints the one line CI looks for: "N passed, N failed". A test file that
// failed before running any test (an import error, a failing set-up) counts as one failure.

const reportSchema = z.object({
  numPassedTests: z.number(),
  numFailedTests: z.number(),
  testResults: z.array(z.object({ status: z.string(), assertionResults: z.array(z.unknown()) })),
});

const path = process.argv[2];
if (!path) throw new Error("usage: summarise-test-results <vitest.json>");

let passed = 0;
let failed = 1;
try {
  const report = reportSchema.parse(JSON.parse(readFileSync(path, "utf8")));
  const brokenFiles = report.testResults.filter((file) => file.status === "failed" && file.assertionResults.length === 0);
  passed = report.numPassedTests;
  failed = report.numFailedTests + brokenFiles.length;
} catch (error) {
  console.error(`No readable test report at ${path}:`, error);
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
