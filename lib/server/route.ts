import "server-only";
import { NextResponse } from "next/server";
import { z } from "zod";
import type { WorkspaceRole } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import { AppError, errorBody, toAppError } from "./errors";
import { parseInput } from "./parse-input";
import type { Principal } from "./principal";
import { readBodyCapped } from "./read-body";
import { authorizeWorkspace, requirePrincipal, type WorkspaceAccess } from "./workspace-access";

/** Next passes the dynamic segments of the route; every workspace route has `slug`, nested ones more. */
type WorkspaceRouteContext = { params: Promise<{ slug: string } & Record<string, string>> };

/** Largest JSON body a route accepts, bytes (these routes carry a few fields; uploads have their own). */
const maxJsonBytes = 64 * 1024;

async function readJson(request: Request): Promise<unknown> {
  // A JSON route never reads a form post: a cross-site <form enctype="text/plain"> cannot pose as JSON.
  if (!/^application\/json\s*(;|$)/i.test(request.headers.get("content-type") ?? "")) {
    throw new AppError("unsupported_media_type");
  }
  const text = new TextDecoder().decode(await readBodyCapped(request, maxJsonBytes));
  if (text.trim() === "") throw new AppError("invalid_json", "The request body is empty; send a JSON object.");
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("invalid_json");
  }
}

const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A cookie-authenticated change must come from our own pages: browsers send Origin on every non-GET
 * request, so one from another site (or none at all) is refused, as better-auth does under /api/auth.
 * API keys are not sent automatically by browsers, so their requests need no such check.
 */
function requireSameOrigin(request: Request, principal: Principal): void {
  if (principal.via !== "session" || safeMethods.has(request.method)) return;
  if (request.headers.get("origin") !== new URL(env.APP_URL).origin) {
    throw new AppError("forbidden", "This request did not come from Bandwright's own pages.");
  }
}

function errorResponse(thrown: unknown): NextResponse {
  const error = toAppError(thrown);
  return NextResponse.json(errorBody(error), { status: error.status });
}

/** A handler's result: a plain value becomes a 200 JSON response; return a Response for other statuses. */
type HandlerResult = Response | Record<string, unknown> | unknown[];

function toResponse(result: HandlerResult): Response {
  return result instanceof Response ? result : NextResponse.json(result);
}

type InputOption<S> = { input?: S };
type ParsedInput<S> = S extends z.ZodType ? z.output<S> : undefined;

async function parseBody<S extends z.ZodType | undefined>(request: Request, schema: S): Promise<ParsedInput<S>> {
  if (!schema) return undefined as ParsedInput<S>;
  return parseInput(schema, await readJson(request)) as ParsedInput<S>;
}

/**
 * Route handler for a signed-in user outside any workspace (e.g. listing and creating workspaces).
 * Resolves the session or API key, parses the JSON body with `input`, and turns AppErrors into JSON.
 */
export function userRoute<S extends z.ZodType | undefined = undefined>(
  options: InputOption<S>,
  handler: (context: { principal: Principal; input: ParsedInput<S>; request: Request }) => Promise<HandlerResult>,
) {
  return async (request: Request): Promise<Response> => {
    try {
      const principal = await requirePrincipal(request.headers);
      requireSameOrigin(request, principal);
      const input = await parseBody(request, options.input as S);
      return toResponse(await handler({ principal, input, request }));
    } catch (thrown) {
      return errorResponse(thrown);
    }
  };
}

/**
 * Route handler under /api/workspaces/{slug}: adds the membership and minimum-role check
 * (non-member → 404, below the role → 403) before the body is even parsed. `sessionOnly` refuses API
 * keys (403) after that check, for what only a person in the browser may do (managing keys).
 */
export function workspaceRoute<S extends z.ZodType | undefined = undefined>(
  options: InputOption<S> & { minimumRole: WorkspaceRole; sessionOnly?: boolean },
  handler: (context: {
    access: WorkspaceAccess;
    input: ParsedInput<S>;
    request: Request;
    /** The route's dynamic segments (`slug` and any nested ones such as `id`). */
    params: Record<string, string>;
  }) => Promise<HandlerResult>,
) {
  return async (request: Request, context: WorkspaceRouteContext): Promise<Response> => {
    try {
      const principal = await requirePrincipal(request.headers);
      const params = await context.params;
      const access = await authorizeWorkspace(principal, params.slug, options.minimumRole);
      if (options.sessionOnly && principal.via !== "session") {
        throw new AppError("forbidden", "API keys cannot be listed, created or revoked with an API key; use the browser.");
      }
      requireSameOrigin(request, principal);
      const input = await parseBody(request, options.input as S);
      return toResponse(await handler({ access, input, request, params }));
    } catch (thrown) {
      return errorResponse(thrown);
    }
  };
}
