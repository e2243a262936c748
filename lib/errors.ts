/**
 * One error vocabulary for route handlers, server actions and pages.
 * The body of every error response is `{ "error": { "code", "message", "issues"? } }`.
 */

export type ErrorCode =
  | "bad_request"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "invalid"
  | "too_large"
  | "unsupported_media_type"
  | "rate_limited"
  | "unavailable"
  | "internal";

const statusOf: Record<ErrorCode, number> = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  invalid: 422,
  too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
};

/** A problem with a field: where (a path such as "body" or "claims.0.graph.text") and what to fix. */
export interface Issue {
  path: string;
  message: string;
}

export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly issues?: Issue[],
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "AppError";
    this.status = statusOf[code];
  }
}

export const unauthenticated = () => new AppError("unauthenticated", "Sign in to continue.");
export const forbidden = (message = "You do not have permission to do this.") => new AppError("forbidden", message);
export const notFound = (what: string) => new AppError("not_found", `${what} was not found.`);
export const invalid = (message: string, issues?: Issue[]) => new AppError("invalid", message, issues);
export const conflict = (message: string, extra?: Record<string, unknown>) => new AppError("conflict", message, undefined, extra);

export interface ErrorBody {
  error: { code: ErrorCode; message: string; issues?: Issue[] } & Record<string, unknown>;
}

export function errorBody(e: AppError): ErrorBody {
  return { error: { code: e.code, message: e.message, ...(e.issues ? { issues: e.issues } : {}), ...(e.extra ?? {}) } };
}
