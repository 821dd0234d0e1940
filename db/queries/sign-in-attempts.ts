import { randomUUID } from "node:crypto";
import { and, eq, gte, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { rateLimit } from "@/db/schema";

// Failed sign-ins per account, kept in better-auth's rate_limit table under keys of our own
// ("account-sign-in|<e-mail>"), so every app process shares them. `last_request` holds the start of the
// current window (ms since the epoch).

const keyFor = (email: string) => `account-sign-in|${email.trim().toLowerCase()}`;

/**
 * Failed sign-ins for this account in the window that is still open.
 * @param windowMs - window length, milliseconds
 */
export async function countFailedSignIns(email: string, windowMs: number): Promise<number> {
  const rows = await db
    .select({ count: rateLimit.count })
    .from(rateLimit)
    .where(and(eq(rateLimit.key, keyFor(email)), gte(rateLimit.lastRequest, Date.now() - windowMs)))
    .limit(1);
  return rows[0]?.count ?? 0;
}

/**
 * Counts one failed sign-in, atomically: a window older than `windowMs` starts again at 1.
 * @param windowMs - window length, milliseconds
 */
export async function recordFailedSignIn(email: string, windowMs: number): Promise<void> {
  const now = Date.now();
  const expired = sql`${rateLimit.lastRequest} < ${now - windowMs}`;
  await db
    .insert(rateLimit)
    .values({ id: randomUUID(), key: keyFor(email), count: 1, lastRequest: now })
    .onConflictDoUpdate({
      target: rateLimit.key,
      set: {
        count: sql`case when ${expired} then 1 else ${rateLimit.count} + 1 end`,
        lastRequest: sql`case when ${expired} then ${now} else ${rateLimit.lastRequest} end`,
      },
    });
}
