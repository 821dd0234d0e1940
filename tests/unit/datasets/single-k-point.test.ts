import { describe, expect, it } from "vitest";
import { type DispersionParseResult, parseDispersionFile } from "@/lib/datasets";
import { longMapping } from "./helpers";

// Issue 11, item 11: a file whose points all share one k-point has no dispersion. It is accepted (the
// energies at one k can still fix an on-site energy) with a warning that the upload returns and the
// summary keeps for the dataset page.

const accepted = (result: DispersionParseResult) => {
  if (!result.ok) throw new Error(`refused: ${JSON.stringify(result.issues)}`);
  return result;
};

describe("a file whose points share one k-point", () => {
  it("is accepted with a warning, kept in the summary", async () => {
    const text = "kx,ky,band,E\n0.5,0.25,1,-1.5\n0.5,0.25,2,2\n0.5,0.25,1,-1.49\n";
    const r = accepted(await parseDispersionFile(text, longMapping()));
    const warning =
      "all 3 points share one k-point, k = (0.5, 0.25, 0) 1/Å: the file holds band energies but no dispersion. " +
      "A fit can determine from it only what the energies at that k-point fix (often the on-site energies), " +
      "and refuses parameters they cannot separate";
    expect(r.warnings).toEqual([warning]);
    expect(r.summary.kPointCount).toBe(1);
    expect(r.summary.warnings).toEqual([warning]);
  });

  it("gives no such warning for two k-points, and keeps the summary's warnings list empty", async () => {
    const r = accepted(await parseDispersionFile("kx,ky,band,E\n0,0,1,-1.5\n0.1,0,1,-1.4\n", longMapping()));
    expect(r.warnings).toEqual([]);
    expect(r.summary.warnings).toEqual([]);
  });
});
