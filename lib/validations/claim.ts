/**
 * Claims attached to a step. The API takes claims in the core's "cairn-claim/1" JSON (validated by
 * lib/core/claims/claim-schema.ts, whose errors name the JSON path); the form has flat text fields, which
 * `claimFormSchema` turns into that JSON. `formFieldOf` maps an error path back to the form field.
 */
import { z } from "./zod";
import * as schema from "@/lib/core/claims/claim-schema";

export const MAX_CLAIMS_PER_REQUEST = 20;

export const attachClaimsSchema = z.object({
  claims: z
    .array(z.record(z.string(), z.unknown()), { message: "Send claims as a list of cairn-claim/1 objects." })
    .min(1, "Attach at least one claim.")
    .max(MAX_CLAIMS_PER_REQUEST, `Attach at most ${MAX_CLAIMS_PER_REQUEST} claims at once.`),
});

const graphFormat = z.enum(schema.GRAPH_FORMATS);

/** Splits "1, 2 3" into ["1", "2", "3"]. */
const listOf = (text: string) => text.split(/[\s,;]+/).filter(Boolean);

export const claimFormSchema = z.object({
  kind: z.enum(schema.CLAIM_KINDS),
  graphFormat: graphFormat,
  graphText: z.string(),
  patternFormat: graphFormat,
  patternText: z.string(),
  op: z.enum(schema.RELATIONS),
  bound: z.string(),
  vector: z.string(),
  induced: z.boolean(),
  embedding: z.string(),
  family: z.string(),
  coefficients: z.string(),
  h: z.string(),
  multiset: z.string(),
  predicate: z.enum(schema.STRUCTURE_PREDICATES),
  parameter: z.string(),
  degreeRelation: z.enum(schema.DEGREE_RELATIONS),
  maxVertices: z.string(),
  enumerationSetting: z.enum(schema.ENUMERATION_CLAIM_SETTINGS),
  maxMultiplicity: z.string(),
  maxLoop: z.string(),
  dynkinData: z.string(),
  cases: z.string(),
  certificate: z.string(),
});
export type ClaimForm = z.infer<typeof claimFormSchema>;

export const emptyClaimForm: ClaimForm = {
  kind: "spectral-radius-bound",
  graphFormat: "named",
  graphText: "",
  patternFormat: "named",
  patternText: "",
  op: "<",
  bound: "2",
  vector: "",
  induced: false,
  embedding: "",
  family: "",
  coefficients: "",
  h: "",
  multiset: "",
  predicate: "tree",
  parameter: "",
  degreeRelation: "=",
  maxVertices: "",
  enumerationSetting: "simple",
  maxMultiplicity: "2",
  maxLoop: "1",
  dynkinData: "",
  cases: "",
  certificate: "",
};

type Issue = { field: keyof ClaimForm; message: string };

function integers(text: string, field: keyof ClaimForm, issues: Issue[]): number[] {
  const parts = listOf(text);
  const bad = parts.find((p) => !/^\d+$/.test(p));
  if (bad !== undefined) issues.push({ field, message: `"${bad}" is not a non-negative integer; separate entries with commas or spaces` });
  return parts.map(Number);
}

/**
 * The stated data of a dynkin-data claim, one per line: "h = 30", "rho = 2cos(pi/30)", "exponents = 1, 7, 11",
 * "marks = 2, 3, 4, 6, 5, 4, 3, 2", "f = 1", "|W| = 696729600", "W(q) = 1, 7, 27, …" (from the highest power
 * down), "[2]_q = 2cos(pi/30)", "[k]_q > 0".
 */
export function dynkinDataFromText(text: string, issues: Issue[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const quantum: { k: number; value: string }[] = [];
  for (const raw of text.split("\n")) {
    const line = raw.trim();
    if (!line) continue;
    if (/^\[\s*k\s*\]_?q\s*>\s*0$/i.test(line) || /^positivity$/i.test(line)) {
      out.quantumPositivity = true;
      continue;
    }
    const q = /^\[\s*(\d+)\s*\]_?q\s*=\s*(.+)$/i.exec(line);
    if (q) {
      quantum.push({ k: Number(q[1]), value: q[2].trim() });
      continue;
    }
    const m = /^([^=:]+?)\s*[=:]\s*(.+)$/.exec(line);
    const key = m?.[1].trim().toLowerCase() ?? "";
    const value = m?.[2].trim() ?? "";
    const ints = () => integers(value, "dynkinData", issues);
    if (["h", "coxeter number"].includes(key)) out.coxeterNumber = ints()[0];
    else if (["rho", "ρ", "spectral radius"].includes(key)) out.spectralRadius = value;
    else if (key === "exponents") out.exponents = ints();
    else if (key === "marks") out.marks = ints();
    else if (["f", "index of connection"].includes(key)) out.indexOfConnection = ints()[0];
    else if (["|w|", "order", "weyl group order"].includes(key)) out.weylGroupOrder = value;
    else if (["w(q)", "poincare", "poincaré", "poincaré polynomial", "poincare polynomial"].includes(key)) out.poincarePolynomial = listOf(value);
    else
      issues.push({
        field: "dynkinData",
        message: `"${line}" is not one of: h = …, rho = …, exponents = …, marks = …, f = …, |W| = …, W(q) = …, [k]_q = …, [k]_q > 0`,
      });
  }
  if (quantum.length) out.quantumIntegers = quantum;
  return out;
}

/** Turns the form's fields into a cairn-claim/1 object; problems are reported per field. */
export function claimFromForm(f: ClaimForm): { claim: Record<string, unknown> } | { issues: Issue[] } {
  const issues: Issue[] = [];
  const need = (field: keyof ClaimForm, what: string) => {
    if (String(f[field]).trim() === "") issues.push({ field, message: `Enter ${what}.` });
  };
  const graph = (format: string, text: string) => ({ format, text });
  const claim: Record<string, unknown> = { format: "cairn-claim/1", kind: f.kind };
  const main = () => {
    need("graphText", "the graph G");
    claim.graph = graph(f.graphFormat, f.graphText);
  };
  switch (f.kind) {
    case "spectral-radius-bound":
      main();
      need("bound", "the bound, e.g. 2, 7/2, sqrt(5) or 2cos(pi/7)");
      Object.assign(claim, { op: f.op, bound: f.bound.trim() });
      break;
    case "vector-certificate":
      main();
      need("bound", "the bound");
      need("vector", "the vector, one rational per vertex");
      Object.assign(claim, { vector: listOf(f.vector), relation: f.op, bound: f.bound.trim() });
      break;
    case "subgraph":
      need("patternText", "the pattern H");
      need("graphText", "the host G");
      Object.assign(claim, { pattern: graph(f.patternFormat, f.patternText), host: graph(f.graphFormat, f.graphText), induced: f.induced });
      if (f.embedding.trim()) claim.embedding = integers(f.embedding, "embedding", issues);
      break;
    case "exclusion":
      need("graphText", "the host G");
      need("patternText", "the excluded patterns, separated by lines of ---");
      Object.assign(claim, {
        host: graph(f.graphFormat, f.graphText),
        patterns: f.patternText
          .split(/^\s*---\s*$/m)
          .map((t) => t.trim())
          .filter(Boolean)
          .map((t) => graph(f.patternFormat, t)),
        induced: f.induced,
      });
      break;
    case "identification":
      main();
      if (f.family.trim()) claim.family = f.family.trim();
      break;
    case "characteristic-polynomial":
      main();
      if (f.coefficients.trim()) claim.coefficients = listOf(f.coefficients);
      break;
    case "eigenvalues":
      main();
      need("h", "h (the denominator in 2cos(πm/h))");
      if (f.h.trim() && !/^\d+$/.test(f.h.trim())) issues.push({ field: "h", message: "h is a positive integer" });
      Object.assign(claim, { h: Number(f.h.trim()), multiset: integers(f.multiset, "multiset", issues) });
      break;
    case "enumeration":
      need("maxVertices", `the largest number of vertices N (at most ${schema.ENUMERATION_MAX_VERTICES})`);
      if (f.maxVertices.trim() && !/^\d+$/.test(f.maxVertices.trim()))
        issues.push({ field: "maxVertices", message: `N is a positive integer (at most ${schema.ENUMERATION_MAX_VERTICES})` });
      need("bound", "the bound, e.g. 2");
      Object.assign(claim, {
        maxVertices: Number(f.maxVertices.trim()),
        op: f.op,
        bound: f.bound.trim(),
        ...settingFields(f),
        graphs: f.patternText
          .split(/^\s*---\s*$/m)
          .map((t) => t.trim())
          .filter(Boolean)
          .map((t) => graph(f.patternFormat, t)),
      });
      break;
    case "coverage":
      need("maxVertices", "the largest number of vertices N");
      if (f.maxVertices.trim() && !/^\d+$/.test(f.maxVertices.trim())) issues.push({ field: "maxVertices", message: "N is a positive integer" });
      Object.assign(claim, { maxVertices: Number(f.maxVertices.trim()), ...settingFields(f) });
      if (f.cases.trim()) {
        try {
          claim.cases = JSON.parse(f.cases);
        } catch (e) {
          issues.push({ field: "cases", message: `The sub-cases must be JSON: ${(e as Error).message}` });
        }
      } else issues.push({ field: "cases", message: 'Enter the sub-cases, e.g. [{ "label": "3.1", "condition": { "predicate": "tree" } }, …].' });
      break;
    case "dynkin-data":
      if (!f.family.trim() && !f.graphText.trim()) issues.push({ field: "family", message: "Enter the type (e.g. E8), the graph G, or both." });
      if (f.family.trim()) claim.type = f.family.trim();
      // The form hides the graph box for B_n, C_n, F4, G2 (given by type only), so text left in it is not sent.
      if (f.graphText.trim() && !schema.namesMultilacedType(f.family)) claim.graph = graph(f.graphFormat, f.graphText);
      Object.assign(claim, dynkinDataFromText(f.dynkinData, issues));
      break;
    case "structure": {
      main();
      claim.predicate = f.predicate;
      if (f.predicate === "max-degree" || f.predicate === "branch-vertices") {
        need("parameter", "the number");
        const [n] = integers(f.parameter, "parameter", issues);
        claim.parameter = n;
        if (f.predicate === "max-degree") claim.relation = f.degreeRelation;
      } else if (f.predicate === "leg-lengths") {
        need("parameter", "the leg lengths, e.g. 1, 2, 5");
        claim.parameter = integers(f.parameter, "parameter", issues);
      }
      break;
    }
  }
  if (f.certificate.trim()) {
    try {
      claim.certificate = JSON.parse(f.certificate);
    } catch {
      issues.push({ field: "certificate", message: "The certificate must be JSON, e.g. as shown under an earlier verdict." });
    }
  }
  return issues.length ? { issues } : { claim };
}

/** A form's whole number as typed; anything else is passed on as text so the claim's validation names the field. */
const wholeNumber = (t: string): number | string => (/^\s*\d+\s*$/.test(t) ? Number(t.trim()) : t.trim());

/** The setting fields of an enumeration or coverage claim, as the form names them. */
function settingFields(f: ClaimForm): Record<string, unknown> {
  if (f.enumerationSetting === "tree") return { setting: "tree" };
  if (f.enumerationSetting === "multigraph") return { setting: "multigraph", maxMultiplicity: wholeNumber(f.maxMultiplicity), maxLoop: wholeNumber(f.maxLoop) };
  return {};
}

/** The form field for an error path such as "claims.0.graph.text" or "claims.0.patterns[1].text". */
export function formFieldOf(path: string): keyof ClaimForm | null {
  const rest = path.replace(/^claims\.\d+\.?/, "");
  if (/^(graph|host)\b/.test(rest)) return "graphText";
  if (/^(pattern|patterns|graphs)\b/.test(rest)) return "patternText";
  if (/^maxVertices\b/.test(rest)) return "maxVertices";
  if (/^setting\b/.test(rest)) return "enumerationSetting";
  if (/^maxMultiplicity\b/.test(rest)) return "maxMultiplicity";
  if (/^maxLoop\b/.test(rest)) return "maxLoop";
  if (/^(bound)\b/.test(rest)) return "bound";
  if (/^(op|relation)\b/.test(rest)) return "op";
  if (/^vector\b/.test(rest)) return "vector";
  if (/^embedding\b/.test(rest)) return "embedding";
  if (/^(family|type)\b/.test(rest)) return "family";
  if (/^(coxeterNumber|spectralRadius|exponents|marks|indexOfConnection|weylGroupOrder|poincarePolynomial|quantumIntegers|quantumPositivity)\b/.test(rest))
    return "dynkinData";
  if (/^coefficients\b/.test(rest)) return "coefficients";
  if (/^h\b/.test(rest)) return "h";
  if (/^multiset\b/.test(rest)) return "multiset";
  if (/^parameter\b/.test(rest)) return "parameter";
  if (/^cases\b/.test(rest)) return "cases";
  if (/^certificate\b/.test(rest)) return "certificate";
  return null;
}

/**
 * The claims of a claims document as the offline checker reads it (one `cairn-claim/1` claim, an
 * array of claims, or `{ "format": "cairn-claims/1", "claims": [...] }`), ready for the API; the
 * claims themselves are validated by the server, which names the field of any problem.
 */
export function claimsFromDocument(text: string): { claims: Record<string, unknown>[] } | { problem: string } {
  if (!text.trim()) return { problem: "Paste a claims document or choose a file." };
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    return { problem: `This is not JSON: ${(e as Error).message}` };
  }
  const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);
  let list: unknown[] | null = null;
  if (Array.isArray(json)) list = json;
  else if (isObject(json) && json.format === schema.CLAIM_FORMAT) list = [json];
  else if (isObject(json) && json.format === schema.CLAIMS_FILE_FORMAT && Array.isArray(json.claims)) list = json.claims;
  if (list === null)
    return { problem: `Expected one "${schema.CLAIM_FORMAT}" claim, an array of claims, or { "format": "${schema.CLAIMS_FILE_FORMAT}", "claims": [...] }.` };
  if (list.length === 0) return { problem: "The document holds no claims." };
  if (list.length > MAX_CLAIMS_PER_REQUEST)
    return { problem: `The document holds ${list.length} claims; attach at most ${MAX_CLAIMS_PER_REQUEST} at once (split the file).` };
  const notObject = list.findIndex((c) => !isObject(c));
  if (notObject >= 0) return { problem: `Claim ${notObject + 1} is not a JSON object.` };
  return { claims: list as Record<string, unknown>[] };
}

/** A server issue about claim N of a document, in words: "claim 2 (E7-below-2), graph.text: …". */
export function describeClaimIssue(path: string, message: string, claims: readonly Record<string, unknown>[]): string {
  const m = /^claims\.(\d+)\.?(.*)$/.exec(path);
  if (!m) return `${path}: ${message}`;
  const i = Number(m[1]);
  const id = typeof claims[i]?.id === "string" ? ` (${claims[i].id as string})` : "";
  return `claim ${i + 1}${id}${m[2] ? `, ${m[2]}` : ""}: ${message}`;
}
