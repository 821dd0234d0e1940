import { type APIError, isAPIError } from "better-auth/api";

/** Every failure the app reports on purpose, with the HTTP status it maps to. */
export const appErrorStatus = {
  bad_request: 400,
  invalid_json: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  validation_failed: 422,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type AppErrorCode = keyof typeof appErrorStatus;

const safeMessages: Record<AppErrorCode, string> = {
  bad_request: "The request could not be understood.",
  invalid_json: "The request body is not valid JSON.",
  unauthenticated: "Sign in first.",
  forbidden: "Your role in this workspace does not allow this.",
  not_found: "Not found.",
  conflict: "This conflicts with existing data.",
  payload_too_large: "The request body is too large.",
  unsupported_media_type: "Send the request body as JSON (Content-Type: application/json).",
  validation_failed: "Some fields are invalid.",
  rate_limited: "Too many attempts; wait a moment and try again.",
  internal: "Something went wrong on our side.",
  unavailable: "A service the app depends on is unavailable.",
};

/** Per-field messages, as produced by zod's flattenError. */
export type FieldIssues = Record<string, string[]>;

/**
 * The one error type of the web layer. `message` is shown to the client, so it must never carry a
 * cause; pass the cause separately, it is logged only.
 */
export class AppError extends Error {
  readonly code: AppErrorCode;
  readonly issues?: FieldIssues;

  constructor(code: AppErrorCode, message?: string, options?: { issues?: FieldIssues; cause?: unknown }) {
    super(message ?? safeMessages[code], { cause: options?.cause });
    this.name = "AppError";
    this.code = code;
    this.issues = options?.issues;
  }

  get status(): number {
    return appErrorStatus[this.code];
  }
}

/** JSON body of every error response: `{ error: { code, message, issues? } }`. */
export type ErrorBody = { error: { code: AppErrorCode; message: string; issues?: FieldIssues } };

/** Converts anything thrown into a safe AppError, logging what is not one. */
export function toAppError(thrown: unknown): AppError {
  if (thrown instanceof AppError) return thrown;
  if (isAPIError(thrown)) return fromAuthError(thrown);
  console.error(thrown);
  return new AppError("internal", undefined, { cause: thrown });
}

export function errorBody(error: AppError): ErrorBody {
  return { error: { code: error.code, message: error.message, ...(error.issues ? { issues: error.issues } : {}) } };
}

const authStatusCodes: Record<number, AppErrorCode> = {
  400: "bad_request",
  401: "unauthenticated",
  403: "forbidden",
  404: "not_found",
  413: "payload_too_large",
  422: "validation_failed",
  429: "rate_limited",
};

// better-auth's messages are written for end users (e.g. "Invitation not found"), so they are passed on.
function fromAuthError(error: APIError): AppError {
  const code = authStatusCodes[error.statusCode];
  if (!code) {
    console.error(error);
    return new AppError("internal", undefined, { cause: error });
  }
  return new AppError(code, error.body?.message ?? undefined, { cause: error });
}
