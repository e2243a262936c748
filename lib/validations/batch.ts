import { z } from "zod";
import { ENUMERATION_MAX_VERTICES, MULTIGRAPH_MAX_WEIGHT, RELATIONS } from "@/lib/core/claims/claim-schema";
import { MAX_BATCH_PATTERNS } from "@/lib/core/claims/batch";
import { SMITH_FAMILIES } from "@/lib/core/families/smith-families";

const fileId = z.number({ message: "choose an uploaded graph list" }).int().positive();
const FAMILIES = Object.keys(SMITH_FAMILIES) as [string, ...string[]];

/** Every graph satisfies ρ(G) op bound (the kind may be left out). */
const spectral = z.object({
  fileId,
  kind: z.literal("spectral-radius-bound"),
  op: z.enum(RELATIONS, { message: `one of ${RELATIONS.join(" ")}` }),
  bound: z.string().trim().min(1, "give the bound, e.g. 2 or sqrt(2+sqrt(5))").max(500),
});

/** Every graph contains one of (or none of) the patterns, each in a graph syntax (graph6, edge list, star(3), …). */
const subgraphs = z.object({
  fileId,
  kind: z.enum(["contains-one-of", "contains-none-of"]),
  patterns: z
    .array(z.string().trim().min(1, "a pattern is empty").max(2_000, "write a pattern in at most 2000 characters"), { message: "list the patterns" })
    .min(1, "list at least one pattern, e.g. star(3)")
    .max(MAX_BATCH_PATTERNS, `at most ${MAX_BATCH_PATTERNS} patterns`),
  induced: z.boolean().default(false),
});

/** Every graph is identified as a member of one of the families (Smith's classification). */
const identified = z.object({
  fileId,
  kind: z.literal("identified-as"),
  families: z
    .array(z.enum(FAMILIES, { message: `a family: one of ${FAMILIES.join(", ")}` }), { message: "list the families" })
    .min(1, "list at least one family, e.g. A and D")
    .max(MAX_BATCH_PATTERNS),
});

/**
 * The list is, up to isomorphism, exactly the trees (or connected simple graphs, or connected graphs with loops and
 * multiple edges within the two bounds) on n vertices, optionally with ρ op b. The size cap per setting and bound and
 * the pairing of the bounds with "multigraph" are the core's (validateEnumerationBatch), answered as 422 on "vertices".
 */
const enumeration = z.object({
  fileId,
  kind: z.literal("enumeration-exactly"),
  setting: z.enum(["tree", "simple", "multigraph"], { message: "tree, simple or multigraph" }),
  maxMultiplicity: z.number({ message: "the largest edge multiplicity, 1 to 4" }).int().min(1).max(MULTIGRAPH_MAX_WEIGHT).optional(),
  maxLoop: z.number({ message: "the largest loop weight, 0 to 4" }).int().min(0).max(MULTIGRAPH_MAX_WEIGHT).optional(),
  vertices: z
    .number({ message: "the number of vertices" })
    .int()
    .min(1)
    .max(ENUMERATION_MAX_VERTICES, `at most ${ENUMERATION_MAX_VERTICES} vertices, as for an enumeration claim; lower the number of vertices`),
  op: z.enum(["<", "<="], { message: "< or <=" }).optional(),
  bound: z.string().trim().min(1).max(500).optional(),
});

/** A batch claim over a graph list uploaded to the step. */
export const createBatchSchema = z.preprocess(
  (v) => (v && typeof v === "object" && !Array.isArray(v) && !("kind" in v) ? { ...v, kind: "spectral-radius-bound" } : v),
  z.discriminatedUnion("kind", [spectral, subgraphs, identified, enumeration], {
    message: "kind: one of spectral-radius-bound, contains-one-of, contains-none-of, identified-as, enumeration-exactly",
  }),
);
export type CreateBatchInput = z.infer<typeof createBatchSchema>;
