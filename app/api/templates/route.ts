import { listTemplates } from "@/lib/tb";
import { userRoute } from "@/lib/server/route";

/**
 * The model templates: `{ templates: [{ id, title, description, dimension, orbitals, parameters (defaults),
 * latticeConstant, supportsOverlap, source, kPath }] }`. Signed-in users only.
 */
export const GET = userRoute({}, async () => ({
  templates: listTemplates().map(({ orbitalCount, ...t }) => ({ ...t, orbitals: orbitalCount })),
}));
