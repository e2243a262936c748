import "server-only";
/**
 * Blind review applied to every surface that names people: one lens per (proof, viewer) that turns a
 * referee's name into "Referee k" when lib/review/rounds.ts says this viewer may not see it (authors,
 * and other referees, on a blind proof). Read per request, so switching blind on hides names at once.
 */
import { models } from "@/models";
import { refereeDisplayName } from "@/lib/review/rounds";
import type { ProofRole } from "@/lib/access/rules";
import { listReferees } from "./rounds";

export interface NameLens {
  /** The name to show for this person (unchanged for non-referees). */
  name(userId: number, name: string): string;
  /** Whether this person's e-mail address and id must stay hidden from the viewer. */
  hides(userId: number): boolean;
  /** The id to show for this person: a hidden referee is −k ("Referee k"), so that no id can be matched to a person. */
  id(userId: number): number;
}

/** Whether the proof is refereed blind (read per request: switching it on hides names at once). */
export async function isBlind(proofId: number): Promise<boolean> {
  return (await models().Proof.findByPk(proofId, { attributes: ["blindReview"] }))?.blindReview ?? false;
}

const open: NameLens = { name: (_id, name) => name, hides: () => false, id: (userId) => userId };

export async function refereeLens(proofId: number, viewer: { id: number; role: ProofRole | null }): Promise<NameLens> {
  const proof = await models().Proof.findByPk(proofId, { attributes: ["blindReview"] });
  if (!proof?.blindReview || viewer.role === "editor") return open;
  const referees = new Map((await listReferees(proofId)).map((r) => [r.userId, r.index]));
  const hides = (userId: number) => referees.has(userId) && userId !== viewer.id;
  return {
    hides,
    id: (userId) => (hides(userId) ? -referees.get(userId)! : userId),
    name: (userId, name) =>
      referees.has(userId)
        ? refereeDisplayName({ viewerRole: viewer.role ?? "author", viewerId: viewer.id, blind: true, refereeId: userId, name, index: referees.get(userId)! })
        : name,
  };
}

/** The viewer's lens on each of several proofs (their own role on each). */
export async function refereeLenses(proofIds: number[], viewerId: number): Promise<Map<number, NameLens>> {
  const roles = await models().ProofMember.findAll({ where: { proofId: proofIds, userId: viewerId }, attributes: ["proofId", "role"] });
  const entries = await Promise.all(
    proofIds.map(async (id) => [id, await refereeLens(id, { id: viewerId, role: roles.find((r) => r.proofId === id)?.role ?? null })] as const),
  );
  return new Map(entries);
}
