import type { ReactNode } from "react";
import type { WorkspaceRole } from "@/lib/auth/roles";
import { cx } from "./class-names";

export type BadgeTone = "neutral" | "accent" | "success" | "caution" | "danger";

const tones: Record<BadgeTone, string> = {
  neutral: "bg-surface-sunken text-ink-muted ring-line",
  accent: "bg-accent-50 text-accent-800 ring-accent-200",
  success: "bg-success-50 text-success-700 ring-success-600/25",
  caution: "bg-caution-50 text-caution-700 ring-caution-600/25",
  danger: "bg-danger-50 text-danger-700 ring-danger-600/25",
};

/** A small label for a status or role. Text carries the meaning; colour only supports it. */
export function Badge({ tone = "neutral", children }: { tone?: BadgeTone; children: ReactNode }) {
  return (
    <span className={cx("inline-flex items-center rounded px-1.5 py-0.5 text-xs font-medium ring-1 ring-inset", tones[tone])}>
      {children}
    </span>
  );
}

const roleTones: Record<WorkspaceRole, BadgeTone> = { owner: "accent", editor: "success", viewer: "neutral" };

/** Human-readable names of the workspace roles. */
export const roleLabels: Record<WorkspaceRole, string> = { owner: "Owner", editor: "Editor", viewer: "Viewer" };

/** What each role may do, shown next to role pickers. */
export const roleDescriptions: Record<WorkspaceRole, string> = {
  owner: "manages members and invitations, can delete anything",
  editor: "uploads datasets, defines models, launches fits",
  viewer: "reads and exports only",
};

/** Badge for a workspace role. */
export function RoleBadge({ role }: { role: WorkspaceRole }) {
  return <Badge tone={roleTones[role]}>{roleLabels[role]}</Badge>;
}
