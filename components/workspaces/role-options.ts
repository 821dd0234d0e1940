import { workspaceRoles } from "@/lib/auth/roles";
import { roleDescriptions, roleLabels, type SelectOption } from "@/components/ui";

/** Role choices for selects, most privileged first, each with what the role may do. */
export const roleOptions: SelectOption[] = workspaceRoles.map((role) => ({
  value: role,
  label: `${roleLabels[role]} — ${roleDescriptions[role]}`,
}));

/** Short role choices for compact selects inside table rows. */
export const shortRoleOptions: SelectOption[] = workspaceRoles.map((role) => ({ value: role, label: roleLabels[role] }));
