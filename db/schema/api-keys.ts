import { sql } from "drizzle-orm";
import { check, index, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";

/**
 * Keys for scripts: `Authorization: Bearer <key>`. Only the SHA-256 of the key is stored; a key acts
 * as its user (who created it), within one workspace, with the lower of its own role and that user's
 * current role there — so demoting a member demotes their keys too.
 */
export const apiKey = pgTable(
  "api_key",
  {
    id: text("id").primaryKey(),
    label: text("label").notNull(),
    keyHash: text("key_hash").notNull().unique(),
    /** First characters of the key, shown in lists so a user can tell keys apart. */
    keyPrefix: text("key_prefix").notNull(),
    /** The most the key may do: owner, editor or viewer (never above its user's role when created). */
    role: text("role").$type<"owner" | "editor" | "viewer">().notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    workspaceId: text("workspace_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
  },
  (t) => [
    index("api_key_user_id_idx").on(t.userId),
    index("api_key_workspace_id_idx").on(t.workspaceId),
    check("api_key_role_check", sql`${t.role} in ('owner', 'editor', 'viewer')`),
  ],
);
export type ApiKey = typeof apiKey.$inferSelect;
export type NewApiKey = typeof apiKey.$inferInsert;
