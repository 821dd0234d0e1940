import PgBoss from "pg-boss";
import { describe, expect, it } from "vitest";
import { MAX_FIT_TIME_LIMIT_MS, fitOptionsSchema } from "@/lib/fit/bands";
import { fitJobExpirySeconds, fitQueue, maxJobExpirySeconds, sendFitJob } from "@/lib/server/queues";

// The fit job's expiry against pg-boss 10's own send() check (attorney.js: `expireIn / 3600 < 24`), with a
// stand-in for its `db` option that records the insert instead of running it: no database needed.

function recordingDb(rows: unknown[] = [{ id: "00000000-0000-4000-8000-000000000001" }]) {
  const inserts: unknown[][] = [];
  return { inserts, db: { executeSql: async (_text: string, values: unknown[]) => (inserts.push(values), { rows }) } };
}
// Never started: send() with a `db` option only checks its arguments and runs the insert there.
const boss = new PgBoss({ connectionString: "postgres://nobody@127.0.0.1:9/none" });
// createJob's values: the 10th is expire_in, seconds (pg-boss/src/manager.js).
const expiryOf = (values: unknown[]) => values[9];

describe("a fit job's expiry", () => {
  it("pg-boss refuses 24 h and accepts 86 399 s", async () => {
    const { db } = recordingDb();
    await expect(boss.send(fitQueue.name, {}, { expireInSeconds: 86_400, db })).rejects.toThrow("expiration cannot exceed 24 hours");
    await expect(boss.send(fitQueue.name, {}, { expireInSeconds: maxJobExpirySeconds, db })).resolves.toBeTruthy();
  });

  it("the longest time limit the launch accepts gives a job pg-boss takes", async () => {
    expect(fitOptionsSchema.safeParse({ timeLimitMs: MAX_FIT_TIME_LIMIT_MS }).success).toBe(true);
    expect(fitOptionsSchema.safeParse({ timeLimitMs: MAX_FIT_TIME_LIMIT_MS + 1 }).error?.issues[0].message).toBe("at most 68 400 000 ms (19 h)");
    const { db, inserts } = recordingDb();
    const id = await sendFitJob(boss, { revisionId: "r", timeLimitMs: MAX_FIT_TIME_LIMIT_MS, marginSeconds: 15, db });
    expect(id).toBe("00000000-0000-4000-8000-000000000001");
    // ⌈1.25 × 68 400 s + 15 s⌉ = 85 515 s, still above the limit itself
    expect(expiryOf(inserts[0])).toBe(85_515);
  });

  it("stays below 24 h whatever the margin", async () => {
    expect(fitJobExpirySeconds(MAX_FIT_TIME_LIMIT_MS, 5000)).toBe(maxJobExpirySeconds);
    const { db, inserts } = recordingDb();
    await sendFitJob(boss, { revisionId: "r", timeLimitMs: MAX_FIT_TIME_LIMIT_MS, marginSeconds: 5000, db });
    expect(expiryOf(inserts[0])).toBe(86_399);
  });

  it("a job the queue does not take is an error, not a silent null", async () => {
    const { db } = recordingDb([]);
    await expect(sendFitJob(boss, { revisionId: "r", timeLimitMs: 60_000, marginSeconds: 15, db })).rejects.toThrow("the queue did not take the job of revision r");
  });
});
