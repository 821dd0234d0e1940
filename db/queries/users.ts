import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { user } from "@/db/schema";

export async function getUserById(id: string) {
  const rows = await db
    .select({ id: user.id, name: user.name, email: user.email })
    .from(user)
    .where(eq(user.id, id))
    .limit(1);
  return rows[0] ?? null;
}

export async function getUserByEmail(email: string) {
  const rows = await db
    .select({ id: user.id, name: user.name, email: user.email })
    .from(user)
    .where(eq(user.email, email.toLowerCase()))
    .limit(1);
  return rows[0] ?? null;
}
