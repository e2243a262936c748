import "server-only";
import { forbidden, notFound, redirect } from "next/navigation";
import { accessRefusal, proofAccess, requireStepAccess, type ProofAction, type ProofAccess } from "@/lib/access";
import { AppError } from "@/lib/errors";

/**
 * For pages, the access module's answer as a page: no session → sign-in, no such proof or not a member →
 * not found (a page does not tell outsiders that a proof exists), a member whose standing the table
 * refuses for `action` → forbidden (HTTP 403). Call it first, before anything streams, so the status holds.
 */
export async function pageAccess(rawProofId: string, action: ProofAction = "proof.read"): Promise<ProofAccess> {
  const proofId = Number(rawProofId);
  if (!Number.isInteger(proofId) || proofId <= 0) notFound();
  let access: ProofAccess;
  try {
    access = await proofAccess(proofId);
  } catch (e) {
    if (e instanceof AppError && e.status === 401) redirect("/sign-in");
    if (e instanceof AppError && (e.status === 403 || e.status === 404)) notFound();
    throw e;
  }
  if (accessRefusal(access.standing, action)) forbidden();
  return access;
}

/** A step page's access: a step that is gone, or outside a case-limited member's cases, is not found. */
export async function stepPageAccess(rawProofId: string, rawStepId: string) {
  const access = await pageAccess(rawProofId);
  const stepId = Number(rawStepId);
  if (!Number.isInteger(stepId) || stepId <= 0) notFound();
  return orNotFound(
    requireStepAccess(access.proofId, stepId).catch((e) =>
      Promise.reject(e instanceof AppError && e.status === 403 ? new AppError("not_found", "This step") : e),
    ),
  );
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
