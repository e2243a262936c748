import { z } from "./zod";

const id = z.number().int().positive();
export const caseTitleSchema = z.string().trim().min(1, "Give the case a title.").max(300, "Keep the title under 300 characters.");
export const caseConditionSchema = z.string().trim().max(5_000, "Keep the condition short (under 5 000 characters).");

export const createCaseSchema = z.object({
  /** The case this one refines; null or absent for a top-level case. */
  parentId: id.nullable().optional(),
  title: caseTitleSchema,
  condition: caseConditionSchema.default(""),
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
    move: z.enum(["up", "down"]).optional(),
    parentId: id.nullable().optional(),
    confirm: z.boolean().optional(),
  })
  .refine((v) => v.title !== undefined || v.condition !== undefined || v.move !== undefined || v.parentId !== undefined, {
    message: "Say what to change: title, condition, move (up or down) or parentId.",
  });
export type UpdateCaseInput = z.infer<typeof updateCaseSchema>;

export const deleteCaseSchema = z.object({ confirm: z.boolean().optional() });
