import { parameterLabel } from "@/lib/views/parameter-label";

/**
 * A parameter's typeset name (`V(ppπ) Si–Si, shell 1`) with, when it differs, the stored name that API
 * bodies and exports use (`V_ppπ[Si–Si,1]`) in small type below.
 */
export function ParameterName({ name }: { name: string }) {
  const label = parameterLabel(name);
  return (
    <>
      <span className="font-medium">{label}</span>
      {label !== name ? <code className="block font-mono text-xs font-normal text-ink-muted">{name}</code> : null}
    </>
  );
}
