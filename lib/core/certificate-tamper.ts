/**
 * Test support: change exactly one entry of a certificate, to show that a re-check rejects it.
 * Plain TypeScript with no test-framework import, so any test in the project can use it.
 */

/**
 * Changes one entry of a JSON value: the first number found (depth first) is increased by one, or in
 * the first string holding digits, its first run of digits is.
 */
export function tamper(value: unknown): unknown {
  let done = false;
  const walk = (v: unknown): unknown => {
    if (done) return v;
    if (typeof v === "number") { done = true; return v + 1; }
    if (typeof v === "string" && /\d/.test(v)) {
      done = true;
      return v.replace(/-?\d+/, (k) => String(BigInt(k) + 1n));
    }
    if (Array.isArray(v)) return v.map(walk);
    if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, walk(x)]));
    return v;
  };
  const out = walk(value);
  if (!done) throw new Error("nothing to tamper with");
  return out;
}
