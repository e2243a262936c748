import { z } from "./zod";

export const proofTitleSchema = z.string().trim().min(1, "Give the proof a title.").max(300, "Keep the title under 300 characters.");
export const proofStatementSchema = z
  .string()
  .trim()
  .min(1, "State the theorem (Markdown with $…$ math).")
  .max(100_000, "The statement is longer than 100 000 characters.");

export const createProofSchema = z.object({ title: proofTitleSchema, statement: proofStatementSchema });
export type CreateProofInput = z.infer<typeof createProofSchema>;

export const updateProofSchema = z
  .object({ title: proofTitleSchema.optional(), statement: proofStatementSchema.optional() })
  .refine((v) => v.title !== undefined || v.statement !== undefined, { message: "Change the title or the statement." });
export type UpdateProofInput = z.infer<typeof updateProofSchema>;
