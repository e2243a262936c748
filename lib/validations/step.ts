import { z } from "./zod";

export const stepBodySchema = z.string().max(200_000, "A step is limited to 200 000 characters; split it into several steps.");

export const createStepSchema = z.object({ body: stepBodySchema.refine((b) => b.trim().length > 0, "Write the step before saving it.") });
export type CreateStepInput = z.infer<typeof createStepSchema>;

/**
 * Saving a step names the revision it was edited from. When a newer revision exists the save is
 * refused (409, with the newer revision); to overwrite knowingly, the editor saves again naming that
 * newer revision as its base.
 */
export const saveRevisionSchema = z.object({
  baseRevisionId: z.number({ message: "Name the revision you edited (baseRevisionId)." }).int().positive(),
  body: stepBodySchema.refine((b) => b.trim().length > 0, "Write the step before saving it."),
});
export type SaveRevisionInput = z.infer<typeof saveRevisionSchema>;

/** Moves a step one place up or down within its case. */
export const moveStepSchema = z.object({ move: z.enum(["up", "down"], { message: 'move must be "up" or "down"' }) });

export const diffQuerySchema = z.object({
  from: z.coerce.number().int().positive({ message: "from must be a revision number" }),
  to: z.coerce.number().int().positive({ message: "to must be a revision number" }),
});
