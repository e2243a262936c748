/**
 * What Cairn says while its database does not answer: the API's 503 body (lib/http.ts) and the page
 * that proxy.ts serves with status 503 instead of a page that would fail. One message for both.
 */

/** Seconds a client should wait before retrying after a 503 for a database outage. */
export const RETRY_AFTER_SECONDS = 5;

export const DATABASE_UNAVAILABLE = "The database is not answering at the moment; nothing was changed. This is temporary: try again in a few seconds.";

/** A self-contained page (no scripts, no styles to allow): the message, and a reload after a while. */
export function unavailablePage(): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="refresh" content="${RETRY_AFTER_SECONDS * 2}"><title>Cairn is briefly unavailable</title></head>
<body><main><h1>Cairn is briefly unavailable</h1><p data-testid="unavailable">${DATABASE_UNAVAILABLE}</p>
<p>This page tries again by itself every ${RETRY_AFTER_SECONDS * 2} seconds.</p></main></body></html>`;
}
