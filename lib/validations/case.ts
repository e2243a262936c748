import { z } from "./zod";
import type { Issue } from "@/lib/errors";
import { ConditionError, parseCondition, type ConditionSetting } from "@/lib/core/families/case-condition";
import { describeCondition } from "@/lib/core/families/condition-words";

/**
 * A case stores the whole condition language (patterns with loops and multiple edges, and "branch-vertices"
 * alike); a coverage claim reads each sub-case's condition again in its own setting when it is made.
 */
export const STORED_CONDITION: ConditionSetting = { multigraph: "either" };

const id = z.number().int().positive();
export const caseTitleSchema = z.string().trim().min(1, "Give the case a title.").max(300, "Keep the title under 300 characters.");
export const caseConditionSchema = z.string().trim().max(5_000, "Keep the condition short (under 5 000 characters).");

/**
 * The machine-readable condition as JSON text (lib/core/families/case-condition.ts); empty means none.
 * A problem is reported with the JSON path inside the condition, e.g. "$.and[1].relation: expected …".
 */
export const casePredicateSchema = z
  .string()
  .max(20_000, "Keep the machine-readable condition under 20 000 characters.")
  .superRefine((text, ctx) => {
    const reading = readConditionText(text);
    if (reading && "problem" in reading)
      ctx.addIssue({
        code: "custom",
        message: `${reading.path}: ${reading.problem} (see the condition language in the help: { "predicate": "tree" }, { "and": [ … ] }, …)`,
      });
  });

/** A condition as typed, read: in words, or the problem at its JSON path; null when the text is empty. The form shows it live, the pages show stored ones. */
export function readConditionText(text: string): { words: string } | { path: string; problem: string } | null {
  if (!text.trim()) return null;
  try {
    return { words: describeCondition(parseCondition(text, "$", STORED_CONDITION)) };
  } catch (e) {
    if (!(e instanceof ConditionError)) throw e;
    return { path: e.path, problem: e.detail };
  }
}

/** The stored form: normalised JSON, or null for none. */
export function normalisedPredicate(text: string | null | undefined): string | null {
  return text && text.trim() ? JSON.stringify(parseCondition(text, "$", STORED_CONDITION)) : null;
}

/**
 * A sub-case's stored condition read again in a coverage claim's setting (simple graphs, or graphs with
 * loops and multiple edges): null when it fits, else the problem at `path` (the claim's JSON path of the
 * condition, extended to the part that does not fit), naming the case by its number.
 */
export function subCaseConditionIssue(sub: { number: string; title: string; predicate: string }, setting: ConditionSetting, path: string): Issue | null {
  try {
    parseCondition(sub.predicate, path, setting);
    return null;
  } catch (e) {
    if (!(e instanceof ConditionError)) throw e;
    return { path: e.path, message: `Case ${sub.number} “${sub.title}”: ${e.detail}` };
  }
}

/** A case's own fields as its forms edit them (adding a case and editing one). */
export const caseFieldsSchema = z.object({ title: caseTitleSchema, condition: caseConditionSchema, predicate: casePredicateSchema });
export type CaseFields = z.infer<typeof caseFieldsSchema>;

export const createCaseSchema = z.object({
  /** The case this one refines; null or absent for a top-level case. */
  parentId: id.nullable().optional(),
  title: caseTitleSchema,
  condition: caseConditionSchema.default(""),
  predicate: casePredicateSchema.nullable().optional(),
});
export type CreateCaseInput = z.input<typeof createCaseSchema>;

/**
 * One change to a case: edit its title/condition, move it up or down among its siblings, or move it
 * under another parent. Moving a case that holds steps or reviews needs `confirm: true`.
 */
export const updateCaseSchema = z
  .object({
    title: caseTitleSchema.optional(),
    condition: caseConditionSchema.optional(),
    /** JSON text of the machine-readable condition; "" or null removes it. */
    predicate: casePredicateSchema.nullable().optional(),
    move: z.enum(["up", "down"]).optional(),
    parentId: id.nullable().optional(),
    confirm: z.boolean().optional(),
  })
  .refine((v) => v.title !== undefined || v.condition !== undefined || v.predicate !== undefined || v.move !== undefined || v.parentId !== undefined, {
    message: "Say what to change: title, condition, predicate, move (up or down) or parentId.",
  });
export type UpdateCaseInput = z.infer<typeof updateCaseSchema>;

export const deleteCaseSchema = z.object({ confirm: z.boolean().optional() });
