import { describe, expect, it } from "vitest";
import { caseState, latestVouches, proofState, stepStatus, type CaseFacts, type StepFacts } from "./states";

// The rules under test are Cairn's own (see ../shared product notes: case and proof states); no outside source applies.
const step = (over: Partial<StepFacts> = {}): StepFacts => ({ id: 1, latestRevision: 2, reviews: [], claims: [], authorIds: [9], ...over });
const approve = (reviewerId: number, revisionNumber: number) => ({ reviewerId, revisionNumber, verdict: "vouch" as const, disputeState: null });
const dispute = (reviewerId: number, state: "raised" | "answered" | "withdrawn" | "upheld") => ({
  reviewerId,
  revisionNumber: 2,
  verdict: "dispute" as const,
  disputeState: state,
});
const one = (s: StepFacts, children: CaseFacts[] = []): CaseFacts => ({ id: 1, steps: [s], children });

describe("step status", () => {
  it("counts vouches per reviewer at the latest revision and marks older ones stale", () => {
    const s = stepStatus(step({ reviews: [approve(1, 2), approve(1, 2), approve(2, 1)] }), 1);
    expect(s).toMatchObject({ vouches: 1, supersededVouches: 1, vouched: true });
    expect(stepStatus(step({ reviews: [approve(2, 1)] }), 1)).toMatchObject({ vouches: 0, supersededVouches: 1, vouched: false });
  });

  it("ignores an author's approval of their own step", () => {
    expect(stepStatus(step({ reviews: [approve(9, 2)] }), 1).vouched).toBe(false);
  });

  it("does not count the approval of a reviewer whose own dispute on the step is unresolved", () => {
    expect(stepStatus(step({ reviews: [approve(1, 2), dispute(1, "raised")] }), 1)).toMatchObject({ vouches: 0, vouched: false });
    expect(stepStatus(step({ reviews: [approve(1, 2), dispute(1, "withdrawn")] }), 1)).toMatchObject({ vouches: 1, vouched: true });
    expect(stepStatus(step({ reviews: [approve(2, 2), dispute(1, "answered")] }), 1)).toMatchObject({ vouches: 1, openDisputes: 1, settled: false });
  });

  it("needs the required number of vouches", () => {
    expect(stepStatus(step({ reviews: [approve(1, 2)] }), 2).vouched).toBe(false);
    expect(stepStatus(step({ reviews: [approve(1, 2), approve(3, 2)] }), 2).vouched).toBe(true);
  });
});

describe("case state", () => {
  it("is drafting before any verdict, under review after one", () => {
    expect(caseState(one(step()), 1)).toBe("drafting");
    expect(caseState(one(step({ reviews: [approve(1, 1)] })), 1)).toBe("under review");
  });

  it("is disputed while a dispute is open, answered or reopened, and settled once it is closed and vouches are current", () => {
    for (const st of ["raised", "answered", "upheld"] as const) expect(caseState(one(step({ reviews: [approve(1, 2), dispute(1, st)] })), 1)).toBe("disputed");
    expect(caseState(one(step({ reviews: [approve(1, 2), dispute(1, "withdrawn")] })), 1)).toBe("settled");
  });

  it("reports a refuted claim before anything else and needs every claim verified to settle", () => {
    expect(caseState(one(step({ reviews: [approve(1, 2), dispute(1, "raised")], claims: ["refuted"] })), 1)).toBe("claim failing");
    expect(caseState(one(step({ reviews: [approve(1, 2)], claims: ["verified", "pending"] })), 1)).toBe("under review");
    expect(caseState(one(step({ reviews: [approve(1, 2)], claims: ["verified"] })), 1)).toBe("settled");
  });

  it("rolls sub-cases up into their parent", () => {
    const settled = step({ reviews: [approve(1, 2)] });
    expect(caseState(one(settled, [one(step({ id: 2 }))]), 1)).toBe("under review");
    expect(caseState({ id: 1, steps: [], children: [] }, 1)).toBe("drafting");
  });
});

describe("proof state", () => {
  it("is ready to certify only when every case is settled", () => {
    const settled = one(step({ reviews: [approve(1, 2)] }));
    expect(proofState([settled, settled], 1)).toBe("ready to certify");
    expect(proofState([settled, one(step())], 1)).toBe("in progress");
    expect(proofState([], 1)).toBe("in progress");
  });
});

describe("latest vouches", () => {
  it("keeps each referee's last vouch, in the order first given, superseded when older than the latest revision", () => {
    const v = (reviewerId: number, revisionNumber: number, verdict: "vouch" | "dispute" = "vouch") => ({ reviewerId, revisionNumber, verdict });
    const listed = latestVouches([v(7, 1), v(8, 1), v(9, 2, "dispute"), v(7, 3)], 3);
    expect(listed.map(({ review, superseded }) => [review.reviewerId, review.revisionNumber, superseded])).toEqual([
      [7, 3, false],
      [8, 1, true],
    ]);
    expect(latestVouches([], 1)).toEqual([]);
  });
});
