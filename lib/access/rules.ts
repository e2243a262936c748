/**
 * Who may do what on a proof: the one table of proof role × action, with the case scope, and the one
 * filter of what a case-limited member may see. Pure TypeScript (no framework, no database), read by
 * every page, route handler and server action through lib/access/index.ts, and by components that
 * hide what the server would refuse.
 *
 * Standing on a proof: its role (author, reviewer, editor), whether the person created the proof (the
 * owner), and whether a reviewer was invited to chosen cases only (case-limited). A site admin has no
 * standing on a proof they are not a member of: admin pages are their own (the mail view).
 */
import type { DisputeTarget } from "@/lib/review/rules";
import { casesBelow } from "@/lib/proof-tree";

export type ProofRole = "author" | "reviewer" | "editor";

export interface Actor {
  id: number;
  role: ProofRole;
}

export interface Standing {
  role: ProofRole;
  owner: boolean;
  /** Invited to chosen cases only: sees those cases and their sub-cases, nothing of the whole proof. */
  caseLimited: boolean;
}

export type ProofAction =
  | "proof.read" // the proof page, its cases and steps (a case-limited member: within scope)
  | "proof.edit" // title and statement
  | "cases.write" // add, edit, move, delete and restore cases
  | "steps.write" // add, move and revise steps
  | "claims.write" // attach and withdraw claims
  | "claims.recheck"
  | "files.upload" // upload graph lists, claims files and documents to a step (reading them: proof.read, in scope)
  | "verdict.give" // vouch for or dispute a step (lib/access/rules verdictRefusal adds the per-step rules)
  | "reviewers.manage" // invite, revoke, share the whole proof, required vouches
  | "exports.read" // list and download exports, the print view
  | "exports.create"
  | "timeline.read" // the audit trail (a case-limited member: events of their cases only)
  | "statement.discuss" // read and post comments on the proof's statement (a condition's thread: proof.read, in scope)
  | "authors.invite" // invite co-authors by e-mail
  | "editors.invite" // invite editors by e-mail
  | "members.remove" // remove another member (their vouches, disputes and reports stay, attributed)
  | "ownership.transfer"; // hand the proof's ownership to another author or editor

interface Rule {
  roles: readonly ProofRole[];
  /** The proof's creator may, whatever their role. */
  owner?: boolean;
  /** A case-limited member is refused: the thing shows or changes the whole proof. */
  wholeProof?: boolean;
  refusal: string;
  /** What a case-limited member is told (default: the exports' refusal). */
  caseLimitedRefusal?: string;
}

const ALL: readonly ProofRole[] = ["author", "reviewer", "editor"];

/** The table. Change a permission here and nowhere else. */
export const ACCESS: Readonly<Record<ProofAction, Rule>> = {
  "proof.read": { roles: ALL, refusal: "You are not a member of this proof." },
  "proof.edit": { roles: ["author"], refusal: "Only the proof's authors edit its title and statement." },
  "cases.write": { roles: ["author"], refusal: "Only the proof's authors change its cases." },
  "steps.write": { roles: ["author"], refusal: "Only the proof's authors write steps." },
  "claims.write": { roles: ["author"], refusal: "Only the proof's authors attach or withdraw claims." },
  "files.upload": { roles: ["author"], owner: true, refusal: "Only the proof's authors (and its owner) upload files to its steps." },
  "claims.recheck": { roles: ["author", "editor"], refusal: "Only an author or an editor re-checks a claim." },
  "verdict.give": { roles: ["reviewer"], refusal: "Only invited reviewers give verdicts on steps." },
  "reviewers.manage": { roles: ["editor"], owner: true, refusal: "Only an editor or the proof's owner invites reviewers and changes review settings." },
  "exports.read": {
    roles: ALL,
    wholeProof: true,
    refusal: "Exports hold the whole proof, and you were invited to review some of its cases only. Ask an editor to share the whole proof with you.",
  },
  "exports.create": { roles: ["author", "editor"], wholeProof: true, refusal: "Only an author or an editor makes an export of the whole proof." },
  "timeline.read": { roles: ALL, refusal: "You are not a member of this proof." },
  "statement.discuss": {
    roles: ALL,
    wholeProof: true,
    refusal: "You are not a member of this proof.",
    caseLimitedRefusal: "The discussion of the statement concerns the whole proof, and you were invited to review some of its cases only.",
  },
  "authors.invite": { roles: ["author", "editor"], owner: true, refusal: "Only an author, an editor or the proof's owner invites co-authors." },
  "editors.invite": { roles: ["editor"], owner: true, refusal: "Only an editor or the proof's owner invites editors." },
  "members.remove": { roles: ["editor"], owner: true, refusal: "Only an editor or the proof's owner removes members." },
  "ownership.transfer": { roles: [], owner: true, refusal: "Only the proof's owner hands over its ownership." },
};

/** The action that inviting someone with this role needs. */
export const INVITE_ACTION: Readonly<Record<ProofRole, ProofAction>> = { author: "authors.invite", reviewer: "reviewers.manage", editor: "editors.invite" };

/** On a blind proof only editors see referees' names, so only editors manage (invite, list, remove) referees. */
export const BLIND_REFEREES_REFUSAL = "This proof is refereed blind: only its editors manage the referees, so that their names stay hidden from the authors.";

/** Why this standing may not invite someone as `role`, or null when it may. */
export function invitationRefusal(standing: Standing, role: ProofRole, blind: boolean): string | null {
  if (role === "reviewer" && blind && standing.role !== "editor") return BLIND_REFEREES_REFUSAL;
  return accessRefusal(standing, INVITE_ACTION[role]);
}

/**
 * Why this person may not remove the member `target`, or null when they may. Anyone but the owner may
 * leave (remove themselves); the owner must hand over ownership first (a conflict, decided by the caller).
 */
export function removalRefusal(standing: Standing, actorId: number, target: { userId: number; role: ProofRole }, blind: boolean): string | null {
  if (target.userId === actorId) return null;
  if (target.role === "reviewer" && blind && standing.role !== "editor") return BLIND_REFEREES_REFUSAL;
  return accessRefusal(standing, "members.remove");
}

/** Ownership goes to a current author or editor: a referee owning the proof would manage their own refereeing. */
export const mayOwn = (role: ProofRole) => role !== "reviewer";

/** Why this standing may not take this action, or null when it may. */
export function accessRefusal(standing: Standing, action: ProofAction): string | null {
  const rule = ACCESS[action];
  if (rule.wholeProof && standing.caseLimited) return rule.caseLimitedRefusal ?? ACCESS["exports.read"].refusal;
  if (rule.roles.includes(standing.role) || (rule.owner && standing.owner)) return null;
  return rule.refusal;
}

export const may = (standing: Standing, action: ProofAction) => accessRefusal(standing, action) === null;

/**
 * THE filter of what a case-limited member may see: the items whose case is in scope. `visible` is null
 * for a member who sees the whole proof (everything passes). An item of no case (caseOf gives null)
 * belongs to the whole proof and is shown only to whole-proof members.
 */
export function withinScope<T>(items: readonly T[], caseOf: (item: T) => number | null, visible: ReadonlySet<number> | null): T[] {
  if (visible === null) return [...items];
  return items.filter((item) => {
    const caseId = caseOf(item);
    return caseId !== null && visible.has(caseId);
  });
}

/** Whole proof (null) or the given cases and everything below them. */
export function expandScope(scopeCaseIds: readonly number[], cases: ReadonlyArray<{ id: number; parentId: number | null }>): Set<number> | null {
  return scopeCaseIds.length === 0 ? null : casesBelow(scopeCaseIds, cases);
}

/** Why this person may not give a verdict on this step, or null when they may. */
export function verdictRefusal(actor: Actor, stepAuthorIds: readonly number[], inScope: boolean): string | null {
  if (actor.role !== "reviewer") return ACCESS["verdict.give"].refusal;
  if (stepAuthorIds.includes(actor.id)) return "You wrote a revision of this step; an author never vouches for or disputes their own step.";
  if (!inScope) return "This step is in a case you were not asked to review.";
  return null;
}

/** Why this person may not move the dispute to `to`, or null when they may. */
export function disputeRefusal(actor: Actor, disputingReviewerId: number, to: DisputeTarget): string | null {
  if (to === "answered") return actor.role === "author" ? null : "Only the proof's authors mark a dispute as answered.";
  if (actor.id === disputingReviewerId || actor.role === "editor") return null;
  return `Only the reviewer who raised this dispute (or an editor) can ${to === "withdrawn" ? "withdraw" : "uphold"} it.`;
}
