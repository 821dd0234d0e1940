import { sql } from "drizzle-orm";
import { db } from "@/db/client";

/** Runs a trivial query; throws when the database does not answer. */
export async function pingDatabase(): Promise<void> {
  await db.execute(sql`select 1`);
}
