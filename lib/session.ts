import "server-only";
import { getServerSession } from "next-auth";
import { authOptions } from "@/lib/auth";
import { forbidden, notFound, unauthenticated } from "@/lib/errors";
import { proofAndRole } from "@/lib/data/proofs";
import { sessionIsCurrent } from "@/lib/data/users";
import type { ProofRole } from "@/lib/access/rules";
import type { GlobalRole } from "@/models/user";

export interface CurrentUser {
  id: number;
  name: string;
  email: string;
  role: GlobalRole;
}

/**
 * The person of this request's session, or null. Every page, route handler and server action reads the
 * session here, and here a token whose version is no longer the person's (signed out, password changed)
 * stops being a session. A database that does not answer throws (503), it does not sign anyone out.
 */
export async function getCurrentUser(): Promise<CurrentUser | null> {
  const session = await getServerSession(authOptions);
  const id = Number(session?.user?.id);
  if (!session?.user || !Number.isInteger(id) || id <= 0) return null;
  const version = session.user.sessionVersion;
  if (typeof version !== "number" || !(await sessionIsCurrent(id, version))) return null;
  return { id, name: session.user.name ?? "", email: session.user.email ?? "", role: session.user.role };
}

/** The signed-in user, or a 401 error. */
export async function requireUser(): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) throw unauthenticated();
  return user;
}

/**
 * The per-proof permission check used by every route handler and server action:
 * 401 without a session, 404 for a proof that does not exist, 403 for a non-member or a member
 * whose role is not among `roles` (any role when `roles` is empty).
 */
export async function requireProofRole(proofId: number, ...roles: ProofRole[]): Promise<{ user: CurrentUser; role: ProofRole }> {
  const user = await requireUser();
  const found = await proofAndRole(proofId, user.id);
  if (!found) throw notFound("This proof");
  const { role } = found;
  if (!role) throw forbidden("You are not a member of this proof.");
  if (roles.length > 0 && !roles.includes(role))
    throw forbidden(`This needs the ${roles.join(" or ")} role on this proof; you are ${role === "author" ? "an" : "a"} ${role}.`);
  return { user, role };
}
