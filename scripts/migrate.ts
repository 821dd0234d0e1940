import { migrate } from "drizzle-orm/postgres-js/migrator";
import { closeDatabase, db } from "@/db/client";

// Applies the committed drizzle-kit migrations in ./drizzle to DATABASE_URL (idempotent).
await migrate(db, { migrationsFolder: "./drizzle" });
await closeDatabase();
console.log("[bandwright] database migrated");
