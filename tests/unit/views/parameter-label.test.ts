import { describe, expect, it } from "vitest";
import { parameterLabel } from "@/lib/views";

describe("parameterLabel", () => {
  it("typesets bond integrals, overlaps and on-site energies; other names stay as they are", () => {
    expect(parameterLabel("V_ppπ[Si–Si,1]")).toBe("V(ppπ) Si–Si, shell 1");
    expect(parameterLabel("V_s*pσ[Ga–As,2]")).toBe("V(s*pσ) Ga–As, shell 2");
    expect(parameterLabel("S_ppπ[C–C,3]")).toBe("S(ppπ) C–C, shell 3");
    expect(parameterLabel("E_s*[Ga]")).toBe("E(s*) Ga");
    expect(parameterLabel("E_p[C]")).toBe("E(p) C");
    expect(parameterLabel("t1")).toBe("t1");
    expect(parameterLabel("energy offset")).toBe("energy offset");
  });
});
