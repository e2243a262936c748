/**
 * The response headers that keep user content inert in the browser: a Content-Security-Policy with a
 * fresh nonce per request for scripts (Next.js puts the nonce on its own scripts when it sees it in
 * the request's CSP header), no framing, no MIME sniffing. Styles allow inline attributes: KaTeX and
 * the Markdown editor position glyphs with style="…", which cannot carry a nonce, and a style cannot
 * run script. Pure; used by proxy.ts. The headers every response carries (nosniff, no framing) are
 * set for all paths, static files included, in next.config.mjs.
 */

export function contentSecurityPolicy(nonce: string, { dev = false } = {}): string {
  return [
    "default-src 'self'",
    // 'strict-dynamic': scripts loaded by a nonced script (Next's chunks) are trusted, nothing else is.
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    `connect-src 'self'${dev ? " ws: wss:" : ""}`,
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/** For responses that are not pages (the API, files): nothing may run or frame them. */
export const API_CSP = "default-src 'none'; frame-ancestors 'none'";

/** A nonce of 128 random bits, base64. */
export function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return btoa(String.fromCharCode(...bytes));
}
