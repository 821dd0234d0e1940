import { describe, expect, it } from "vitest";
import { workspaceSlugFor } from "@/lib/server/workspace-slug";
import { workspaceSlugSchema } from "@/lib/schemas/workspaces";

describe("workspaceSlugFor", () => {
  it("turns a name into lower-case words plus an 8-character hex suffix", () => {
    expect(workspaceSlugFor("Halvorsen Quantum Materials Lab")).toMatch(/^halvorsen-quantum-materials-lab-[0-9a-f]{8}$/);
    expect(workspaceSlugFor("Ærø & Ångström group")).toMatch(/^r-angstrom-group-[0-9a-f]{8}$|^aer/);
  });

  it("always yields an address the slug schema accepts", () => {
    for (const name of ["", "!!!", "x".repeat(200), "Ünïcödé Lab", " -- lead - trail -- "]) {
      expect(workspaceSlugSchema.safeParse(workspaceSlugFor(name)).success, name).toBe(true);
    }
  });

  it("gives two workspaces with the same name different slugs", () => {
    expect(workspaceSlugFor("Same")).not.toBe(workspaceSlugFor("Same"));
  });
});
