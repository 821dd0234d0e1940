import { sql } from "drizzle-orm";
import { closeDatabase, db } from "@/db/client";

// Empties the database in DATABASE_URL for a test run on a server we did not create: our tables, the
// migration journal and pg-boss's schema. Only scripts/test.sh calls it, with TEST_DATABASE_URL.
await db.execute(sql`drop schema if exists public cascade`);
await db.execute(sql`drop schema if exists drizzle cascade`);
await db.execute(sql`drop schema if exists pgboss cascade`);
await db.execute(sql`create schema public`);
await closeDatabase();
console.log("[bandwright] test database emptied");
