/**
 * A drafted step for the tests of the verification jobs (its proof dropped after the file), with the calls they share:
 * attach claims as the author, read a claim's row and how often a worker decided it, start a worker process (killed after
 * each test by workersPerTest) and read its name. The test file mocks next-auth, as for every route handler test.
 */
import { beforeAll } from "vitest";
import { actAs, closeAfterAll, jsonRequest, params } from "./helpers";
import { draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { startTestWorker, type TestWorker } from "../support/workers";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";

// Trees on n = 1..14 vertices: OEIS A000055. Connected graphs on n = 1..8 vertices: OEIS A001349.
export const A000055 = [1, 1, 1, 2, 3, 6, 11, 23, 47, 106, 235, 551, 1301, 3159];
export const A001349 = [1, 1, 2, 6, 21, 112, 853, 11117];

export function claimJobsStep(title: string, workers: TestWorker[]) {
  const place = { proofId: "", stepId: "" };
  closeAfterAll(() => dropProofs([place.proofId]));
  beforeAll(async () => {
    Object.assign(place, await draftCaseStep(title, "Jobs", "Checked by the workers."));
  });
  return {
    proofId: () => place.proofId,
    stepId: () => place.stepId,
    /** Attaches the claims to the step as the author; the answer's status and claims. */
    attach: async (claims: unknown[]) => {
      await actAs("author");
      const res = await claimsRoute.POST(jsonRequest("/x", "POST", { claims }), params(place));
      return { status: res.status, claims: (await res.json()).claims as Array<{ id: number; status: string }> };
    },
    claimRow: (id: number) => models().Claim.unscoped().findByPk(id),
    /** How many times a worker stored a verdict for the claim (its audit events). */
    decisions: (id: number) => models().AuditEvent.count({ where: { action: "claim.decided", subjectType: "claim", subjectId: id } }),
    /** A worker process with this process's settings and `env` over them (no sweep of its own unless `env` asks). */
    worker: (env: Record<string, string> = {}) => {
      const w = startTestWorker({ ...process.env, CAIRN_SWEEP_AFTER_MS: "600000", ...env }, `.data/jobs-test-worker-${workers.length}.log`);
      workers.push(w);
      return w;
    },
    /** The worker's name (host:pid), once it said it is taking jobs. */
    nameOf: async (w: TestWorker) => {
      await w.ready;
      return /\] (\S+) is taking verification jobs/.exec(w.output.join("\n"))![1];
    },
  };
}
