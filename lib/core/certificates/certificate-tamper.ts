/**
 * Test support: change exactly one entry of a certificate, to show that a re-check rejects it.
 * Plain TypeScript with no test-framework import, so any test in the project can use it.
 *
 * The entries that can be changed are the numeric leaves of the JSON value, depth first: numbers,
 * and strings holding digits (rationals such as "7/2", big integers, texts such as "ρ(G) = 2").
 */

function isNumericLeaf(v: unknown): boolean {
  return typeof v === "number" || (typeof v === "string" && /\d/.test(v));
}

/** How many entries `tamper` can change. */
export function numericLeafCount(value: unknown): number {
  if (isNumericLeaf(value)) return 1;
  if (Array.isArray(value)) return value.reduce((s: number, x) => s + numericLeafCount(x), 0);
  if (value && typeof value === "object") return Object.values(value).reduce((s: number, x) => s + numericLeafCount(x), 0);
  return 0;
}

/**
 * Changes the `which`-th numeric leaf (default the first): a number is increased by one, and in a
 * string its first run of digits is.
 */
export function tamper(value: unknown, which = 0): unknown {
  let seen = 0;
  const walk = (v: unknown): unknown => {
    if (isNumericLeaf(v)) {
      if (seen++ !== which) return v;
      return typeof v === "number" ? v + 1 : (v as string).replace(/-?\d+/, (k) => String(BigInt(k) + 1n));
    }
    if (Array.isArray(v)) return v.map(walk);
    if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, walk(x)]));
    return v;
  };
  const out = walk(value);
  if (which >= seen) throw new Error(`nothing to tamper with at entry ${which} (${seen} entries)`);
  return out;
}
