/**
 * Route-handler plumbing: turn thrown errors into the one error body, parse JSON bodies with a zod
 * schema, parse numeric route ids. Unknown errors are logged here and sent as a plain 500 message.
 */
import type { ZodType } from "zod";
import { AppError, errorBody, invalid, notFound, type Issue } from "./errors";

export function json(data: unknown, init?: ResponseInit): Response {
  return Response.json(data, init);
}

export function errorResponse(e: unknown): Response {
  if (e instanceof AppError) return Response.json(errorBody(e), { status: e.status });
  console.error("[cairn] unexpected error", e);
  return Response.json(
    { error: { code: "internal", message: "Something went wrong on the server; nothing was changed. Try again, and report it if it persists." } },
    { status: 500 },
  );
}

type Handler<C> = (request: Request, context: C) => Promise<Response>;

/** Wraps a route handler so that every thrown error becomes the one error response. */
export function route<C>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    try {
      return await handler(request, context);
    } catch (e) {
      return errorResponse(e);
    }
  };
}

export function zodIssues(error: { issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey>; message: string }> }): Issue[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join(".") || "body", message: i.message }));
}

/** Reads a JSON body and validates it; 422 with per-field issues when it does not fit. */
export async function readBody<T>(request: Request, schema: ZodType<T>): Promise<T> {
  let raw: unknown;
  try {
    raw = await request.json();
  } catch {
    throw invalid("The request body must be JSON.", [{ path: "body", message: "not valid JSON" }]);
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw invalid("Some fields need attention.", zodIssues(parsed.error));
  return parsed.data;
}

/** Parses a numeric route segment such as `[proofId]`; anything else is a 404 for that resource. */
export function idParam(value: string | undefined, what: string): number {
  if (!value || !/^[1-9][0-9]{0,9}$/.test(value)) throw notFound(what);
  return Number(value);
}
