/**
 * Three jobs on every request: (0) a page request while the database does not answer gets a 503 page
 * with a temporary-error message (lib/unavailable.ts), since a page that fails while rendering can only
 * answer 500 (route handlers answer their own 503 through lib/http.ts); (1) the Content-Security-Policy, with a fresh nonce for pages
 * (lib/security-headers.ts; nosniff and no-framing headers are in next.config.mjs); (2) a convenience redirect of signed-out visitors of workspace pages to
 * the sign-in page. The redirect is not the permission check: every page, route handler and server
 * action asks the access module (lib/access) itself.
 */
import { NextResponse, type NextFetchEvent, type NextRequest } from "next/server";
import { withAuth, type NextRequestWithAuth } from "next-auth/middleware";
import { API_CSP, contentSecurityPolicy, newNonce } from "@/lib/security-headers";
import { pingDatabase } from "@/lib/health";
import { RETRY_AFTER_SECONDS, unavailablePage } from "@/lib/unavailable";

/** Paths open without a session: the landing page, sign-in, invitation links (a new reviewer has no account yet), the API (handlers answer 401 themselves). */
const OPEN = /^\/($|sign-in(\/|$)|invitations\/|api\/)/;

function withSecurityHeaders(request: NextRequest): NextResponse {
  if (request.nextUrl.pathname.startsWith("/api/")) {
    const response = NextResponse.next();
    response.headers.set("Content-Security-Policy", API_CSP);
    return response;
  }
  const csp = contentSecurityPolicy(newNonce(), { dev: process.env.NODE_ENV === "development" });
  const headers = new Headers(request.headers);
  headers.set("Content-Security-Policy", csp); // Next.js reads the nonce from here and puts it on its scripts
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("Content-Security-Policy", csp);
  return response;
}

const signedInOnly = withAuth((request: NextRequestWithAuth) => withSecurityHeaders(request), { pages: { signIn: "/sign-in" } });

/** Pages that read nothing from the database render during an outage too. */
const STATIC_PAGE = /^\/$/;
const PROBE_TIMEOUT_MS = 2_000;

/**
 * One `SELECT 1` on the health connection (lib/health.ts: its own long-lived connection, not the pool)
 * per page request; a refused or cut connection fails at once, a hung one after PROBE_TIMEOUT_MS.
 */
async function databaseAnswers(): Promise<boolean> {
  try {
    await pingDatabase(PROBE_TIMEOUT_MS);
    return true;
  } catch {
    return false;
  }
}

function unavailable(): NextResponse {
  return new NextResponse(unavailablePage(), {
    status: 503,
    headers: {
      "content-type": "text/html; charset=utf-8",
      "retry-after": String(RETRY_AFTER_SECONDS),
      "cache-control": "no-store",
      "Content-Security-Policy": contentSecurityPolicy(newNonce(), { dev: process.env.NODE_ENV === "development" }),
    },
  });
}

export default async function proxy(request: NextRequest, event: NextFetchEvent) {
  const path = request.nextUrl.pathname;
  if (!path.startsWith("/api/") && !STATIC_PAGE.test(path) && !(await databaseAnswers())) return unavailable();
  if (OPEN.test(path)) return withSecurityHeaders(request);
  return signedInOnly(request as NextRequestWithAuth, event);
}

export const config = {
  // Everything but Next's static files and our fonts and icons.
  matcher: ["/((?!_next/static|_next/image|favicon|fonts/|.*\\.(?:svg|png|ico|woff2|css|js)$).*)"],
};
