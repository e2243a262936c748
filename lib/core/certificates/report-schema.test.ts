import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { main } from "../cli";

const SCHEMA = JSON.parse(readFileSync(join(import.meta.dirname, "report.schema.json"), "utf8")) as Schema;
const FIXTURES = join(import.meta.dirname, "../../../tests/fixtures/claims");

type Schema = { [k: string]: unknown };

/**
 * A validator for the part of JSON Schema (2020-12) that report.schema.json uses: type, enum, required,
 * properties, additionalProperties: false, items, minItems, maxItems, minimum, pattern, oneOf and local
 * $ref. It throws on any other keyword, so the schema cannot grow past what this test checks.
 */
function validate(value: unknown, schema: Schema, root: Schema, path = "$"): string[] {
  const known = new Set([
    "$schema",
    "$id",
    "title",
    "description",
    "$defs",
    "type",
    "enum",
    "required",
    "properties",
    "additionalProperties",
    "items",
    "minItems",
    "maxItems",
    "minimum",
    "pattern",
    "oneOf",
    "$ref",
  ]);
  for (const k of Object.keys(schema)) if (!known.has(k)) throw new Error(`validator does not know the keyword ${k}`);
  if (typeof schema.$ref === "string") {
    const target = schema.$ref
      .replace(/^#\//, "")
      .split("/")
      .reduce<unknown>((o, k) => (o as Schema)[k], root) as Schema;
    return validate(value, target, root, path);
  }
  const errors: string[] = [];
  const typeOf = (v: unknown) => (v === null ? "null" : Array.isArray(v) ? "array" : Number.isInteger(v) ? "integer" : typeof v);
  if (schema.type !== undefined) {
    const types = ([] as string[]).concat(schema.type as string | string[]);
    const t = typeOf(value);
    if (!types.includes(t) && !(t === "integer" && types.includes("number"))) return [`${path}: expected ${types.join("|")}, got ${t}`];
  }
  if (schema.enum && !(schema.enum as unknown[]).includes(value)) errors.push(`${path}: ${JSON.stringify(value)} not in enum`);
  if (typeof schema.pattern === "string" && typeof value === "string" && !new RegExp(schema.pattern, "u").test(value))
    errors.push(`${path}: does not match ${schema.pattern}`);
  if (typeof schema.minimum === "number" && typeof value === "number" && value < schema.minimum) errors.push(`${path}: below ${schema.minimum}`);
  if (schema.oneOf) {
    const passing = (schema.oneOf as Schema[]).filter((s) => validate(value, s, root, path).length === 0).length;
    if (passing !== 1) errors.push(`${path}: matches ${passing} of oneOf`);
  }
  if (Array.isArray(value)) {
    if (typeof schema.minItems === "number" && value.length < schema.minItems) errors.push(`${path}: fewer than ${schema.minItems} items`);
    if (typeof schema.maxItems === "number" && value.length > schema.maxItems) errors.push(`${path}: more than ${schema.maxItems} items`);
    if (schema.items) value.forEach((v, i) => errors.push(...validate(v, schema.items as Schema, root, `${path}[${i}]`)));
  } else if (typeof value === "object" && value !== null) {
    const o = value as Record<string, unknown>;
    for (const r of (schema.required as string[] | undefined) ?? []) if (!(r in o)) errors.push(`${path}: missing ${r}`);
    const props = (schema.properties as Record<string, Schema> | undefined) ?? {};
    for (const [k, v] of Object.entries(o)) {
      if (props[k]) errors.push(...validate(v, props[k], root, `${path}.${k}`));
      else if (schema.additionalProperties === false) errors.push(`${path}: unexpected property ${k}`);
    }
  }
  return errors;
}

async function runJson(args: string[]): Promise<unknown> {
  let out = "";
  await main(["--json", ...args], (s) => {
    out += s;
  });
  return JSON.parse(out);
}

describe("the checker's --json report follows lib/core/certificates/report.schema.json", () => {
  it("the validator itself rejects what it should (a wrong status, a missing field, an extra field)", () => {
    const ok = { checkerVersion: "x", reports: [{ source: "f", exitCode: 0, lines: [{ label: "a", status: "verified", text: "t" }] }] };
    expect(validate(ok, SCHEMA, SCHEMA)).toEqual([]);
    expect(validate({ ...ok, reports: [{ ...ok.reports[0], lines: [{ label: "a", status: "proved", text: "t" }] }] }, SCHEMA, SCHEMA)).toEqual([
      '$.reports[0].lines[0].status: "proved" not in enum',
    ]);
    expect(validate({ checkerVersion: "x" }, SCHEMA, SCHEMA)).toEqual(["$: missing reports"]);
    expect(validate({ ...ok, extra: 1 }, SCHEMA, SCHEMA)).toEqual(["$: unexpected property extra"]);
  });

  it("on every claims fixture (verified, refuted, malformed, carried certificates), with separate fields for each checked claim", async () => {
    const files = readdirSync(FIXTURES)
      .filter((f) => f.endsWith(".json"))
      .map((f) => join(FIXTURES, f));
    const report = (await runJson(files)) as { reports: Array<{ lines: Array<Record<string, unknown>> }> };
    expect(validate(report, SCHEMA, SCHEMA)).toEqual([]);
    const lines = report.reports.flatMap((r) => r.lines);
    const checked = lines.filter((l) => l.status !== "malformed");
    expect(checked.length).toBeGreaterThan(20);
    for (const l of checked) {
      expect(l, String(l.label)).toHaveProperty("method");
      expect(l, String(l.label)).toHaveProperty("reason");
      expect(l, String(l.label)).toHaveProperty("timings");
      expect((l.ranOn as unknown[]).length, String(l.label)).toBeGreaterThan(0);
    }
    expect(checked.some((l) => l.bound !== undefined)).toBe(true);
    expect(lines.some((l) => l.status === "malformed")).toBe(true);
  });

  it("undecided verdicts under a tiny budget: the reason says 'budget exceeded' once", async () => {
    const files = ["spectral-radius-bound.json", "vector-certificate.json", "with-certificates.json", "subgraph.json"].map((f) => join(FIXTURES, f));
    const report = (await runJson(["--steps", "3", ...files])) as { reports: Array<{ lines: Array<Record<string, unknown>> }> };
    expect(validate(report, SCHEMA, SCHEMA)).toEqual([]);
    const lines = report.reports.flatMap((r) => r.lines);
    const undecided = lines.filter((l) => l.status === "undecided");
    expect(undecided.length).toBeGreaterThan(3);
    for (const l of lines) {
      const texts = [l.reason, l.text, (l.certificate as { text?: string } | undefined)?.text].filter((t): t is string => typeof t === "string");
      for (const t of texts) expect(t.match(/budget exceeded/g)?.length ?? 0, t).toBeLessThanOrEqual(1);
    }
    for (const l of undecided) {
      expect(l.reason).toMatch(/^budget exceeded: more than 3 steps; retry with a larger budget$/);
      expect(l.certificateKind).toBeNull();
      expect((l.digests as { certificate: unknown }).certificate).toBeNull();
    }
  });

  it("a bound is reported in normal form", async () => {
    const dir = mkdtempSync(join(tmpdir(), "cairn-report-"));
    const path = join(dir, "phi.json");
    writeFileSync(
      path,
      JSON.stringify({
        format: "cairn-claim/1",
        id: "P4",
        kind: "spectral-radius-bound",
        graph: { format: "named", text: "path(4)" },
        op: "=",
        bound: "(1+sqrt(5))/2",
      }),
    );
    const report = (await runJson([path])) as { reports: Array<{ lines: Array<Record<string, unknown>> }> };
    expect(validate(report, SCHEMA, SCHEMA)).toEqual([]);
    // ρ(P4) = 2cos(π/5) = φ (Brouwer & Haemers §1.4.4).
    expect(report.reports[0].lines[0]).toMatchObject({
      status: "verified",
      bound: { kind: "algebraic", polynomial: "x^2 - x - 1", interval: ["1", "2"], rootForm: "root(x^2-x-1, 1, 2)", text: "(1+sqrt(5))/2" },
      ranOn: [{ role: "G", order: 4, size: 3, loops: 0, multipleEdges: 0 }],
    });
  });
});
