/**
 * The address of a comparison: a step page (the author's or the referee's) opened with two of its
 * revisions compared, `?compare=1..3#compare`. Written by the superseded-vouch notice and notification,
 * read by both step pages. Pure: no framework imports.
 */
export const COMPARE_ANCHOR = "compare";

/** The query and anchor that open a step page's comparison of revision `from` with revision `to`. */
export const compareQuery = (from: number, to: number): string => `?compare=${from}..${to}#${COMPARE_ANCHOR}`;

/**
 * Reads `compare` from a page's search parameters: two different revision numbers from 1 to `newest`,
 * or null (a missing, malformed or out-of-range value opens the page with its usual comparison).
 */
export function parseCompare(value: string | string[] | undefined, newest: number): { from: number; to: number } | null {
  const m = typeof value === "string" ? /^(\d{1,6})\.\.(\d{1,6})$/.exec(value) : null;
  if (!m) return null;
  const from = Number(m[1]),
    to = Number(m[2]);
  return from !== to && from >= 1 && to >= 1 && from <= newest && to <= newest ? { from, to } : null;
}
