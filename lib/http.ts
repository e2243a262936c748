/**
 * Route-handler plumbing: turn thrown errors into the one error body, refuse state-changing
 * requests from other sites, parse JSON bodies with a zod schema (right content type, bounded
 * size), parse numeric route ids. Unknown errors are logged here and sent as a plain 500 message;
 * a database that does not answer is a 503 the client may retry.
 */
import { UniqueConstraintError } from "sequelize";
import type { ZodType } from "zod";
import { AppError, errorBody, forbidden, invalid, notFound, type Issue } from "./errors";
import { isDatabaseUnavailable } from "./db";
import { DATABASE_UNAVAILABLE, RETRY_AFTER_SECONDS } from "./unavailable";

export function json(data: unknown, init?: ResponseInit): Response {
  return Response.json(data, init);
}

export function errorResponse(e: unknown): Response {
  if (e instanceof AppError) return Response.json(errorBody(e), { status: e.status });
  if (isDatabaseUnavailable(e)) {
    console.error("[cairn] database unavailable", (e as Error).message);
    return Response.json(errorBody(new AppError("unavailable", DATABASE_UNAVAILABLE)), {
      status: 503,
      headers: { "retry-after": String(RETRY_AFTER_SECONDS) },
    });
  }
  // The unique (parent, position) indexes are the backstop behind the locks: a collision means a
  // concurrent write won the place; nothing was written by this request.
  if (e instanceof UniqueConstraintError)
    return Response.json(errorBody(new AppError("conflict", "Someone else changed this at the same moment; nothing was saved. Reload and try again.")), {
      status: 409,
    });
  console.error("[cairn] unexpected error", e);
  return Response.json(
    { error: { code: "internal", message: "Something went wrong on the server; nothing was changed. Try again, and report it if it persists." } },
    { status: 500 },
  );
}

type Handler<C> = (request: Request, context: C) => Promise<Response>;

const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** The hosts this request may legitimately come from: the one it was sent to (and NEXTAUTH_URL's). */
function ownHosts(request: Request): Set<string> {
  const hosts = new Set<string>([new URL(request.url).host]);
  for (const h of [request.headers.get("host"), request.headers.get("x-forwarded-host")]) if (h) hosts.add(h.split(",")[0].trim().toLowerCase());
  if (process.env.NEXTAUTH_URL) {
    try {
      hosts.add(new URL(process.env.NEXTAUTH_URL).host);
    } catch {
      // a malformed NEXTAUTH_URL adds nothing
    }
  }
  return hosts;
}

/**
 * Refuses a state-changing request that a browser sent from another site (cross-site request
 * forgery): `Sec-Fetch-Site` other than same-origin / none, or an `Origin` that is not this
 * server. Requests without either header are not from a browser page and pass (the session
 * cookie is what they would need, and SameSite keeps it from being sent cross-site anyway).
 */
export function assertSameOrigin(request: Request): void {
  if (!STATE_CHANGING.has(request.method.toUpperCase())) return;
  const refuse = (from: string) =>
    forbidden(`This request came from another site (${from}); Cairn accepts changes only from its own pages. Open Cairn itself and do it there.`);
  const site = request.headers.get("sec-fetch-site");
  if (site && site !== "same-origin" && site !== "none") throw refuse(`Sec-Fetch-Site: ${site}`);
  const origin = request.headers.get("origin");
  if (origin === null) return;
  let host: string | null = null;
  try {
    host = origin === "null" ? null : new URL(origin).host;
  } catch {
    host = null;
  }
  if (!host || !ownHosts(request).has(host)) throw refuse(`Origin: ${origin.slice(0, 100)}`);
}

/**
 * Wraps a route handler so that every thrown error becomes the one error response, and every
 * state-changing request from another site is refused (403) before the handler runs.
 */
export function route<C>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    try {
      assertSameOrigin(request);
      return await handler(request, context);
    } catch (e) {
      return errorResponse(e);
    }
  };
}

export function zodIssues(error: { issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey>; message: string }> }): Issue[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join(".") || "body", message: i.message }));
}

/**
 * Body size limits, chosen per route: `small` for forms of a few fields, `text` for routes that
 * carry a step, a statement or a report (200 000 characters of text at most), `claims` for claim
 * attachments (graphs can be large; 20 claims of 64 MiB each are not accepted in one request).
 */
export const BODY_LIMITS = { small: 64 * 1024, text: 2 * 1024 * 1024, claims: 16 * 1024 * 1024 } as const;

const sizeName = (bytes: number) =>
  bytes % (1024 * 1024) === 0
    ? `${bytes / (1024 * 1024)} MiB`
    : bytes % 1024 === 0 || bytes > 100 * 1024
      ? `${Math.round(bytes / 1024)} KiB`
      : `${bytes} bytes`;

const tooLarge = (limit: number) =>
  new AppError(
    "too_large",
    `The request body is larger than this request's limit of ${sizeName(limit)}; nothing was saved. Send less at once (for claims: fewer or smaller graphs per request).`,
  );

/** Reads the body as bytes, giving up (with `tooBig`, a 413) as soon as more than `limit` bytes have arrived. */
async function readLimitedBytes(request: Request, limit: number, tooBig: () => AppError): Promise<Uint8Array> {
  const declared = Number(request.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw tooBig();
  if (!request.body) return new Uint8Array();
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    let part: ReadableStreamReadResult<Uint8Array>;
    try {
      part = await reader.read();
    } catch {
      // The client went away mid-body (closed tab, lost connection): nothing has been written yet.
      throw new AppError("bad_request", "The request was cut off before its end; nothing was saved. Send it again.");
    }
    const { done, value } = part;
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw tooBig();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, size);
}

/** Reads the body as UTF-8 text, giving up (413) as soon as more than `limit` bytes have arrived. */
async function readLimited(request: Request, limit: number): Promise<string> {
  const bytes = await readLimitedBytes(request, limit, () => tooLarge(limit));
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw invalid("The request body is not valid UTF-8 text.", [{ path: "body", message: "not UTF-8" }]);
  }
}

/** A file sent as the raw request body (uploads): 413 naming the limit past `limit` bytes (checked while reading). */
export function readFileBody(request: Request, limit: number): Promise<Uint8Array> {
  return readLimitedBytes(request, limit, () => uploadTooLarge(limit));
}

/** 413 for a file past the upload limit (one request, or an upload in parts declared or put together past it), naming the limit. */
export const uploadTooLarge = (limit: number) =>
  new AppError(
    "too_large",
    `The file is larger than the upload limit of ${sizeName(limit)}; nothing was saved. Compress a graph list with gzip, or split it into several files.`,
    undefined,
    { limitBytes: limit },
  );

export { sizeName };

/**
 * Reads a JSON body and validates it: 415 unless it is sent as `application/json`, 413 past
 * `limit` bytes (checked while reading), 422 with per-field issues when it does not fit.
 */
export async function readBody<T>(request: Request, schema: ZodType<T>, limit: number = BODY_LIMITS.text): Promise<T> {
  const type = (request.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
  if (type !== "application/json")
    throw new AppError(
      "unsupported_media_type",
      `Send the request body as JSON with the header Content-Type: application/json (it was ${type ? `"${type}"` : "missing"}).`,
    );
  const text = await readLimited(request, limit);
  let raw: unknown;
  try {
    raw = JSON.parse(text);
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
