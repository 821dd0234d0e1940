import { canonicalParameterName, modelDocumentSchema } from "@/lib/tb";
import type { BandFitResult } from "./schema";

/** A result as a revision stores it: the band fit result without its per-point residuals (those are rows). */
export type StoredResult = Omit<BandFitResult, "residuals">;

// A bond-integral name in the earlier spelling inside a warning's text (V_pp_pi[Si-Si,1]).
const LEGACY_NAME_IN_TEXT = /[VS]_[a-z*]+_(?:sigma|pi|delta)\[[A-Za-z][A-Za-z0-9_]*-[A-Za-z][A-Za-z0-9_]*,[1-9][0-9]*\]/g;

/**
 * A stored result read with today's parameter names: revisions stored before bond integrals were spelled
 * `V_ppπ[Si–Si,1]` carry `V_pp_pi[Si-Si,1]` in their parameters, correlations, warnings and fitted model.
 * Results already in today's spelling come back unchanged.
 */
export function readStoredResult(stored: StoredResult): StoredResult {
  const rename = (names: string[]) => names.map(canonicalParameterName);
  return {
    ...stored,
    parameters: stored.parameters.map((p) => ({ ...p, name: canonicalParameterName(p.name) })),
    correlation: { ...stored.correlation, names: rename(stored.correlation.names) },
    warnings: stored.warnings.map((w) => ({
      ...w,
      parameters: rename(w.parameters),
      message: w.message.replace(LEGACY_NAME_IN_TEXT, canonicalParameterName),
    })),
    fittedModel: modelDocumentSchema.parse(stored.fittedModel),
  };
}
