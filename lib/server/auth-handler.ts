import "server-only";
import { toNextJsHandler } from "better-auth/next-js";
import { z } from "zod";
import { countFailedSignIns, recordFailedSignIn } from "@/db/queries/sign-in-attempts";
import { auth } from "@/lib/auth/server";
import { env } from "@/lib/env";
import { errorBody, toAppError } from "./errors";
import { readBodyCapped } from "./read-body";

// The /api/auth/* handler: better-auth's own, plus what it lacks. Bodies are capped before anything reads
// them (better-auth would buffer any size), and failed sign-ins are counted per account, so guessing one
// account's password from many addresses is slowed as well (better-auth's own limit is per address).

/** Largest body any /api/auth endpoint accepts, bytes (they carry an e-mail, a password, a name). */
const maxAuthBodyBytes = 16 * 1024;

const signInPath = "/api/auth/sign-in/email";
const signInBody = z.object({ email: z.string() });

const betterAuthHandlers = toNextJsHandler(auth);

function errorJson(thrown: unknown, headers?: HeadersInit): Response {
  const error = toAppError(thrown);
  return Response.json(errorBody(error), { status: error.status, headers });
}

function signInEmail(path: string, body: Uint8Array<ArrayBuffer>): string | null {
  if (path !== signInPath) return null;
  try {
    const parsed = signInBody.safeParse(JSON.parse(new TextDecoder().decode(body)));
    return parsed.success ? parsed.data.email : null;
  } catch {
    return null;
  }
}

export const GET = betterAuthHandlers.GET;

export async function POST(request: Request): Promise<Response> {
  let body: Uint8Array<ArrayBuffer>;
  try {
    body = await readBodyCapped(request, maxAuthBodyBytes);
  } catch (thrown) {
    return errorJson(thrown);
  }
  const email = signInEmail(new URL(request.url).pathname, body);
  const windowMs = env.AUTH_ACCOUNT_RATE_LIMIT_WINDOW_SECONDS * 1000;
  if (email !== null && (await countFailedSignIns(email, windowMs)) >= env.AUTH_ACCOUNT_RATE_LIMIT_MAX) {
    return Response.json(
      { error: { code: "rate_limited", message: "Too many failed sign-ins for this account; wait a few minutes and try again." } },
      { status: 429, headers: { "retry-after": String(env.AUTH_ACCOUNT_RATE_LIMIT_WINDOW_SECONDS) } },
    );
  }
  const forwarded = new Request(request.url, {
    method: request.method,
    headers: request.headers,
    body: body.byteLength > 0 ? body : undefined,
  });
  const response = await betterAuthHandlers.POST(forwarded);
  // 401 is better-auth's answer to a wrong password (or unknown address): only those count.
  if (email !== null && response.status === 401) await recordFailedSignIn(email, windowMs);
  return response;
}
