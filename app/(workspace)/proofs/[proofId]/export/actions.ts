"use server";
import { revalidatePath } from "next/cache";
import { proofAccess } from "@/lib/access";
import { AppError } from "@/lib/errors";
import { createExport } from "@/lib/data/exports";
import { createExportSchema, type ExportActionResult } from "@/lib/validations/export";

/** Makes an export from the export page; checks the role itself (authors and editors), like the route handler. */
export async function createExportAction(proofId: number, kind: unknown): Promise<ExportActionResult> {
  const parsed = createExportSchema.safeParse({ kind });
  if (!parsed.success) return { ok: false, message: parsed.error.issues[0]?.message ?? "Choose certified or draft." };
  try {
    if (!Number.isInteger(proofId) || proofId <= 0) return { ok: false, message: "This proof was not found." };
    const { user } = await proofAccess(proofId, "exports.create");
    const made = await createExport(proofId, user, parsed.data.kind);
    revalidatePath(`/proofs/${proofId}/export`);
    return { ok: true, exportId: made.id, manifestDigest: made.manifestDigest };
  } catch (e) {
    if (e instanceof AppError) return { ok: false, message: e.message, blockers: (e.extra?.blockers as string[] | undefined) ?? undefined };
    console.error("[cairn] export failed", e);
    return { ok: false, message: "The export could not be made; nothing was recorded. Try again, and report it if it persists." };
  }
}
