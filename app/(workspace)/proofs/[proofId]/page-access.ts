import "server-only";
import { notFound } from "next/navigation";
import { requireProofRole } from "@/lib/session";
import { AppError } from "@/lib/errors";

/** For pages: the viewer's role on the proof; a non-member or a missing proof sees "not found". */
export async function pageRole(rawProofId: string) {
  const proofId = Number(rawProofId);
  if (!Number.isInteger(proofId) || proofId <= 0) notFound();
  try {
    return { proofId, ...(await requireProofRole(proofId)) };
  } catch (e) {
    if (e instanceof AppError && (e.status === 403 || e.status === 404)) notFound();
    throw e;
  }
}

/** Runs a data-layer read, turning its 404 into the page's not-found. */
export async function orNotFound<T>(read: Promise<T>): Promise<T> {
  try {
    return await read;
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    throw e;
  }
}
