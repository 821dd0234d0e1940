import { fileURLToPath } from "node:url";

/**
 * The real DFT band files (tests/data/dft, copied from the team's shared data folder with its README), so
 * that a fresh clone anywhere runs the same tests.
 * @param name - a file name in tests/data/dft, e.g. "silicon-pbe-bands.csv"
 */
export function dftDataPath(name: string): string {
  return fileURLToPath(new URL(`../data/dft/${name}`, import.meta.url));
}
