import "server-only";
/**
 * Comments on the proof's statement and on each case's condition, threaded like step comments (same
 * table: a row with no step is on its case's condition, or with no case either on the statement). Who
 * reads which thread is the access module's: the statement's thread is a whole-proof item, a condition's
 * thread belongs to its case. Names pass through the blind-review lens; notices never name the writer.
 */
import { createHash } from "node:crypto";
import type { Transaction } from "sequelize";
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import { conflict, invalid, notFound } from "@/lib/errors";
import { expandScope, type Actor } from "@/lib/access/rules";
import { caseNumbers, commentsAnchor } from "@/lib/proof-tree";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { refereeLens } from "./blind";
import { commentTree, type CommentNode } from "./comment-tree";
import { liveCases } from "./cases";
import { recordEvent } from "./audit";
import { notify } from "./notifications";

/** Where a comment is: on the statement, or on one case's condition. */
export type CommentPlace = { kind: "statement" } | { kind: "condition"; caseId: number };

export interface PlaceThread {
  /** What is commented on, as the commenter read it, and its digest (sent back with a comment: a changed text is a 409). */
  text: string;
  digest: string;
  comments: CommentNode[];
}

export const textDigest = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");

/** A live case of this proof with its number ("2.1"), or 404 (a case of another proof or under a deleted case is not found). */
export async function conditionCase(proofId: number, caseId: number, transaction?: Transaction) {
  const cases = await liveCases(proofId, transaction);
  const number = caseNumbers(cases).get(caseId);
  const row = cases.find((c) => c.id === caseId);
  if (number === undefined || !row) throw notFound("This case");
  return { id: row.id, number, title: row.title, condition: row.condition };
}

const placeWhere = (proofId: number, place: CommentPlace) => ({ proofId, stepId: null, caseId: place.kind === "statement" ? null : place.caseId });

async function placeText(proofId: number, place: CommentPlace, transaction?: Transaction): Promise<string> {
  if (place.kind === "condition") return (await conditionCase(proofId, place.caseId, transaction)).condition;
  const proof = await models().Proof.findByPk(proofId, { attributes: ["statement"], transaction });
  if (!proof) throw notFound("This proof");
  return proof.statement;
}

async function threads(proofId: number, viewer: Actor, where: { proofId: number; stepId: null; caseId?: number | null | number[] }) {
  const { Comment, User } = models();
  const rows = await Comment.findAll({
    where,
    order: [
      ["createdAt", "ASC"],
      ["id", "ASC"],
    ],
  });
  const lens = await refereeLens(proofId, viewer);
  const ids = [...new Set(rows.map((r) => r.authorId))];
  const names = new Map((ids.length ? await User.findAll({ where: { id: ids }, attributes: ["id", "name"] }) : []).map((u) => [u.id, lens.name(u.id, u.name)]));
  return { rows, tree: (subset: typeof rows) => commentTree(subset, names, lens) };
}

/** One place's thread, with the text it is about. The caller has checked that the viewer may read it. */
export async function getPlaceThread(proofId: number, place: CommentPlace, viewer: Actor): Promise<PlaceThread> {
  const text = await placeText(proofId, place);
  const { rows, tree } = await threads(proofId, viewer, placeWhere(proofId, place));
  return { text, digest: textDigest(text), comments: tree(rows) };
}

/**
 * The overview's threads: the statement's (null when the viewer may not read it) and each visible case's
 * condition thread, by case id. `visible` is the access module's scope (null: the whole proof).
 */
export async function getOverviewThreads(
  proofId: number,
  viewer: Actor,
  visible: ReadonlySet<number> | null,
  statementReadable: boolean,
): Promise<{ statement: PlaceThread | null; conditions: Record<number, PlaceThread> }> {
  const [proof, cases] = await Promise.all([models().Proof.findByPk(proofId, { attributes: ["statement"] }), liveCases(proofId)]);
  const seen = cases.filter((c) => visible === null || visible.has(c.id));
  const { rows, tree } = await threads(proofId, viewer, { proofId, stepId: null });
  const conditions: Record<number, PlaceThread> = {};
  for (const c of seen) conditions[c.id] = { text: c.condition, digest: textDigest(c.condition), comments: tree(rows.filter((r) => r.caseId === c.id)) };
  const statement =
    statementReadable && proof ? { text: proof.statement, digest: textDigest(proof.statement), comments: tree(rows.filter((r) => r.caseId === null)) } : null;
  return { statement, conditions };
}

export interface PlaceCommentInput {
  body: string;
  parentId?: number | null;
  /** The digest of the statement or condition the writer read (from GET); when given and the text changed since, 409. */
  digest?: string | null;
}

/** Who hears of a new comment: the proof's authors and everyone who already wrote in this place, if they still read it. */
async function recipientsOf(proofId: number, place: CommentPlace, actorId: number, transaction: Transaction): Promise<number[]> {
  const { ProofMember, Comment, ReviewerScope, Case } = models();
  const [members, earlier] = await Promise.all([
    ProofMember.findAll({ where: { proofId }, attributes: ["userId", "role"], transaction }),
    Comment.findAll({ where: placeWhere(proofId, place), attributes: ["authorId"], transaction }),
  ]);
  const wanted = new Set([...members.filter((m) => m.role === "author").map((m) => m.userId), ...earlier.map((c) => c.authorId)]);
  wanted.delete(actorId);
  const referees = members.filter((m) => m.role === "reviewer" && wanted.has(m.userId)).map((m) => m.userId);
  const scopes = referees.length ? await ReviewerScope.findAll({ where: { proofId, userId: referees }, attributes: ["userId", "caseId"], transaction }) : [];
  const cases = scopes.length ? await Case.findAll({ where: { proofId }, attributes: ["id", "parentId"], transaction }) : [];
  return members
    .filter((m) => wanted.has(m.userId))
    .filter((m) => {
      const visible =
        m.role === "reviewer"
          ? expandScope(
              scopes.filter((s) => s.userId === m.userId).map((s) => s.caseId),
              cases,
            )
          : null;
      if (visible === null) return true;
      return place.kind === "condition" && visible.has(place.caseId);
    })
    .map((m) => m.userId);
}

/** Adds a comment (or a reply) on the statement or a condition, with its audit event and notices, in one transaction. */
export async function addPlaceComment(proofId: number, place: CommentPlace, actor: Actor, input: PlaceCommentInput): Promise<{ id: number }> {
  const { Comment, Proof } = models();
  const result = await getSequelize().transaction(async (transaction) => {
    const proof = await Proof.findByPk(proofId, { attributes: ["id", "title", "statement"], transaction, lock: transaction.LOCK.SHARE });
    if (!proof) throw notFound("This proof");
    const kase = place.kind === "condition" ? await conditionCase(proofId, place.caseId, transaction) : null;
    const text = kase ? kase.condition : proof.statement;
    if (input.digest && input.digest !== textDigest(text))
      throw conflict(`The ${kase ? "condition" : "statement"} was edited while you wrote; read it again, then post your comment.`, {
        text,
        digest: textDigest(text),
      });
    if (input.parentId) {
      const parent = await Comment.findByPk(input.parentId, { transaction });
      const here = placeWhere(proofId, place);
      if (!parent || parent.proofId !== proofId || parent.stepId !== null || parent.caseId !== here.caseId)
        throw invalid(`You can only reply to a comment on this ${kase ? "condition" : "statement"}.`, [{ path: "parentId", message: "not a comment here" }]);
    }
    const comment = await Comment.create(
      {
        proofId,
        caseId: kase?.id ?? null,
        stepId: null,
        reviewId: null,
        parentId: input.parentId ?? null,
        revisionId: null,
        authorId: actor.id,
        body: input.body,
      },
      { transaction },
    );
    await recordEvent(
      {
        proofId,
        actorId: actor.id,
        action: "comment.added",
        subjectType: kase ? "case" : "proof",
        subjectId: kase ? kase.id : proofId,
        detail: kase ? "on the condition" : "on the statement",
      },
      transaction,
    );
    const where = kase ? `the condition of case ${kase.number} (“${kase.title}”)` : "the statement";
    await notify(
      await recipientsOf(proofId, place, actor.id, transaction),
      {
        kind: "comment_added",
        proofId,
        message: `A new comment on ${where} of “${proof.title}”.`,
        link: `/proofs/${proofId}#${commentsAnchor(kase ? kase.number : null)}`,
      },
      transaction,
    );
    return { id: comment.id };
  });
  await deliverAfterCommit();
  return result;
}
