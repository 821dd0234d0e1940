import { bondIntegralOf, onsiteOf } from "@/lib/tb";

/**
 * A parameter name as the pages show it: bond integrals typeset as `V(ppπ) Si–Si, shell 1` (overlaps
 * `S(ppπ) C–C, shell 1`), on-site energies as `E(s) Si`; any other name (t1, energy offset) as it is.
 * The stored name (`V_ppπ[Si–Si,1]`, what API bodies use) stays available beside it.
 */
export function parameterLabel(name: string): string {
  const integral = bondIntegralOf(name);
  if (integral)
    return `${integral.matrix === "hamiltonian" ? "V" : "S"}(${integral.bond}${integral.kind}) ${integral.pair[0]}–${integral.pair[1]}, shell ${integral.shell}`;
  const onsite = onsiteOf(name);
  if (onsite) return `E(${onsite.shell}) ${onsite.species}`;
  return name;
}
