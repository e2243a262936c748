/** Builds fresh proofs for the review tests, so they never depend on the demo's review state. */
import { readFileSync, existsSync } from "node:fs";
import { beforeAll } from "vitest";
import { models } from "@/models";
import { closeAfterAll, userIdOf, type CloseOptions } from "./helpers";

export interface ReviewFixture {
  proofId: number;
  /** Case ids by number: "1", "2", "2.1". */
  cases: Record<string, number>;
  /** Step ids: "1.1" (case 1, step 1), "2.1", "2.2", "2.1.1". */
  steps: Record<string, number>;
  ids: Record<"author" | "coauthor" | "reviewer" | "editor" | "outsider", number>;
}

let counter = 0;
const made: number[] = [];

/** Removes the proofs this file made (cascading to their cases, reviews, …), so other test files see only the demo. */
export async function dropProofs(): Promise<void> {
  if (made.length) await models().Proof.destroy({ where: { id: made.splice(0) } });
}

export async function makeProof(label = "review test"): Promise<ReviewFixture> {
  const { Proof, ProofMember, Case, Step, StepRevision } = models();
  const ids = {
    author: await userIdOf("author"),
    coauthor: await userIdOf("coauthor"),
    reviewer: await userIdOf("reviewer"),
    editor: await userIdOf("editor"),
    outsider: await userIdOf("outsider"),
  };
  const proof = await Proof.create({ title: `${label} ${++counter} ${Date.now()}`, statement: "Every $x$ is fine.", createdBy: ids.author });
  made.push(proof.id);
  for (const [key, role] of [
    ["author", "author"],
    ["coauthor", "author"],
    ["reviewer", "reviewer"],
    ["editor", "editor"],
  ] as const)
    await ProofMember.create({ proofId: proof.id, userId: ids[key], role });
  const c1 = await Case.create({ proofId: proof.id, parentId: null, position: 1, title: "Small", condition: "$n \\le 3$" });
  const c2 = await Case.create({ proofId: proof.id, parentId: null, position: 2, title: "Large", condition: "$n > 3$" });
  const c21 = await Case.create({ proofId: proof.id, parentId: c2.id, position: 1, title: "Large and even", condition: "$n$ even" });
  const steps: Record<string, number> = {};
  for (const [key, caseId, position] of [
    ["1.1", c1.id, 1],
    ["2.1", c2.id, 1],
    ["2.2", c2.id, 2],
    ["2.1.1", c21.id, 1],
  ] as const) {
    const s = await Step.create({ caseId, position });
    await StepRevision.create({ stepId: s.id, number: 1, body: `Step ${key}: since $x^2 \\ge 0$ we are done.`, authorId: ids.author });
    steps[key] = s.id;
  }
  return { proofId: proof.id, cases: { "1": c1.id, "2": c2.id, "2.1": c21.id }, steps, ids };
}

/**
 * The usual set-up of a review test file: one fresh proof per label, made before its tests (the returned
 * objects are filled in then), dropped after them (then `afterDrop`, for what the file made besides) with the
 * connections closed (see closeAfterAll).
 */
export function reviewProofsForFile(labels: string[], { afterDrop, ...close }: CloseOptions & { afterDrop?: () => Promise<unknown> } = {}): ReviewFixture[] {
  const fixtures = labels.map(() => ({}) as ReviewFixture);
  closeAfterAll(async () => {
    await dropProofs();
    await afterDrop?.();
  }, close);
  beforeAll(async () => {
    for (const [i, label] of labels.entries()) Object.assign(fixtures[i], await makeProof(label));
  });
  return fixtures;
}

export async function latestRevision(stepId: number) {
  const r = await models().StepRevision.findOne({ where: { stepId }, order: [["number", "DESC"]] });
  return r!;
}

/** Saves a new revision, as the workspace's step editor does. */
export async function revise(stepId: number, authorId: number, body = "Revised: $x^2 \\ge 0$ for real $x$.") {
  const latest = await latestRevision(stepId);
  return models().StepRevision.create({ stepId, number: latest.number + 1, body, authorId });
}

interface Captured {
  to: string[];
  subject: string;
  text: string;
}

/** Waits until the local mail fake has stored a message to `to` matching `subject`. */
export async function waitForMail(to: string, subject: RegExp, timeoutMs = 8_000): Promise<Captured> {
  const file = process.env.CAIRN_MAIL_STORE;
  if (!file) throw new Error("CAIRN_MAIL_STORE is not set: run through npm test, which starts the mail fake");
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const all = existsSync(file)
      ? readFileSync(file, "utf8")
          .split("\n")
          .filter(Boolean)
          .map((l) => JSON.parse(l) as Captured)
      : [];
    const hit = all.reverse().find((m) => m.to.includes(to) && subject.test(m.subject));
    if (hit) return hit;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} matching ${subject} reached the mail fake`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

export const mailsTo = (to: string): Captured[] => {
  const file = process.env.CAIRN_MAIL_STORE!;
  return existsSync(file)
    ? readFileSync(file, "utf8")
        .split("\n")
        .filter(Boolean)
        .map((l) => JSON.parse(l) as Captured)
        .filter((m) => m.to.includes(to))
    : [];
};
