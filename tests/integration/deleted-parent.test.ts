/**
 * A step under a deleted case — its own case live, a case above it deleted — is gone for writes as it is
 * for reads: verdicts, comments and dispute moves answer 404 and change nothing.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile, latestRevision } from "./review-fixtures";
import { models } from "@/models";
import * as stepRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/route";
import * as reviewsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as commentsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/comments/route";
import * as disputeRoute from "@/app/api/proofs/[proofId]/disputes/[reviewId]/route";

const [fx] = reviewProofsForFile(["deleted parent"]);
let disputeId: number;
let revisionId: number;

beforeAll(async () => {
  revisionId = (await latestRevision(fx.steps["2.1.1"])).id;
  await actAs("reviewer");
  const raised = await reviewsRoute.POST(
    jsonRequest("/x", "POST", { revisionId, verdict: "dispute", comment: "The even case needs its own argument." }),
    params({ proofId: String(fx.proofId), stepId: String(fx.steps["2.1.1"]) }),
  );
  expect(raised.status).toBe(201);
  disputeId = (await raised.json()).reviewId;
  // Case 2 is deleted; its sub-case 2.1 (holding step 2.1.1) is not deleted on its own.
  await models().Case.update({ deletedAt: new Date() }, { where: { id: fx.cases["2"] } });
});

describe("a step under a deleted parent case", () => {
  const step = () => params({ proofId: String(fx.proofId), stepId: String(fx.steps["2.1.1"]) });
  const counts = async () => {
    const { Review, Comment, DisputeTransition } = models();
    return [
      await Review.count({ where: { stepId: fx.steps["2.1.1"] } }),
      await Comment.count({ where: { stepId: fx.steps["2.1.1"] } }),
      await DisputeTransition.count({ where: { reviewId: disputeId } }),
    ];
  };

  it("is not found on GET", async () => {
    await actAs("reviewer");
    expect((await stepRoute.GET(new Request("http://localhost/x"), step())).status).toBe(404);
  });

  it("refuses a verdict, a comment and a dispute move with 404, and writes nothing", async () => {
    const before = await counts();
    await actAs("reviewer");
    expect((await reviewsRoute.POST(jsonRequest("/x", "POST", { revisionId, verdict: "vouch" }), step())).status).toBe(404);
    expect((await commentsRoute.POST(jsonRequest("/x", "POST", { body: "Still here?" }), step())).status).toBe(404);
    await actAs("author");
    const moved = await disputeRoute.POST(
      jsonRequest("/x", "POST", { to: "answered", comment: "Answered." }),
      params({ proofId: String(fx.proofId), reviewId: String(disputeId) }),
    );
    expect(moved.status).toBe(404);
    expect(await counts()).toEqual(before);
  });
});
