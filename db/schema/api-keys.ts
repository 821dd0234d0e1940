import { index, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";

/**
 * Keys for scripts: `Authorization: Bearer <key>`. Only the SHA-256 of the key is stored; a key acts
 * as its user, within one workspace, with that user's current role there.
 */
export const apiKey = pgTable(
  "api_key",
  {
    id: text("id").primaryKey(),
    label: text("label").notNull(),
    keyHash: text("key_hash").notNull().unique(),
    /** First characters of the key, shown in lists so a user can tell keys apart. */
    keyPrefix: text("key_prefix").notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    workspaceId: text("workspace_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
  },
  (t) => [index("api_key_user_id_idx").on(t.userId)],
);
export type ApiKey = typeof apiKey.$inferSelect;
export type NewApiKey = typeof apiKey.$inferInsert;
