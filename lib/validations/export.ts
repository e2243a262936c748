import { z } from "./zod";

/** Making an export: certified (only when the proof is ready to certify) or draft. */
export const createExportSchema = z.object({
  kind: z.enum(["certified", "draft"], { message: 'Choose the kind of export: "certified" or "draft".' }),
});
export type CreateExportInput = z.infer<typeof createExportSchema>;

/** What making an export answers to the page: the export made, or why not (with the proof's blockers). */
export type ExportActionResult = { ok: true; exportId: number; manifestDigest: string } | { ok: false; message: string; blockers?: string[] };
