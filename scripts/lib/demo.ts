import type { WorkspaceRole } from "@/lib/auth/roles";

// The invented demo scenario. Addresses use the reserved .example domain (RFC 2606), so nothing is ever
// delivered anywhere even if a real SMTP server were configured.

export const demoWorkspace = { name: "Halvorsen Quantum Materials Lab", slug: "halvorsen-lab" } as const;

/** One password for every demo account (printed by npm start, listed in README.md). */
export const demoPassword = "halvorsen-demo-2024";

export const demoUsers: ReadonlyArray<{ name: string; email: string; role: WorkspaceRole }> = [
  { name: "Maren Vikdal", email: "owner@halvorsen-lab.example", role: "owner" },
  { name: "Jonas Brekkestad", email: "editor@halvorsen-lab.example", role: "editor" },
  { name: "Lea Tørrisdal", email: "viewer@halvorsen-lab.example", role: "viewer" },
];
