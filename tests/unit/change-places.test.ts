/** "Since your last visit": which events are changes, and the exact place each links to (lib/review/changes.ts). */
import { describe, expect, it } from "vitest";
import { CHANGE_ACTIONS, changeHref } from "@/lib/review/changes";
import { eventSentence } from "@/lib/review/event-sentences";
import { commentsAnchor } from "@/lib/proof-tree";

const at = (action: string, subjectType: string, stepId: number | null, caseNumber: string | null) =>
  changeHref(7, { action, subjectType, stepId, caseNumber });

describe("changes since the last visit", () => {
  it("counts revisions, claims, verdicts, disputes, reports, decisions and comments, and not settings, membership or exports", () => {
    expect(new Set(Object.values(CHANGE_ACTIONS))).toEqual(new Set(["revision", "claim", "vouch", "dispute", "report", "decision", "comment"]));
    for (const quiet of ["settings.review_policy", "member.removed", "invitation.sent", "export.draft", "round.due_date_set"])
      expect(CHANGE_ACTIONS[quiet]).toBeUndefined();
  });

  it("links each change to its place: the step (its review panel for verdicts, disputes and comments), a thread's anchor, or the rounds", () => {
    expect(at("revision.created", "revision", 41, "2.1")).toBe("/proofs/7/steps/41");
    expect(at("review.disputed", "step", 41, "2.1")).toBe("/proofs/7/steps/41#review");
    expect(at("dispute.answered", "review", 41, "2.1")).toBe("/proofs/7/steps/41#review");
    expect(at("comment.added", "step", 41, "2.1")).toBe("/proofs/7/steps/41#review");
    expect(at("comment.added", "proof", null, null)).toBe(`/proofs/7#${commentsAnchor(null)}`);
    expect(at("comment.added", "case", null, "2.1")).toBe(`/proofs/7#${commentsAnchor("2.1")}`);
    expect(commentsAnchor("2.1")).toBe("case-2.1-comments");
    expect(at("report.submitted", "report", null, null)).toBe("/proofs/7/rounds");
    expect(at("round.decided", "round", null, null)).toBe("/proofs/7/rounds");
  });

  it("words comments on the statement and on a condition", () => {
    const none = { step: null, caseNumber: null, caseTitle: null };
    expect(eventSentence({ action: "comment.added", subjectType: "proof", actorName: "Referee 2", detail: "on the statement", place: none })).toBe(
      "Referee 2 commented on the statement.",
    );
    expect(
      eventSentence({
        action: "comment.added",
        subjectType: "case",
        actorName: "Ada Quenby",
        detail: "on the condition",
        place: { ...none, caseNumber: "3", caseTitle: "Large" },
      }),
    ).toBe("Ada Quenby commented on the condition of case 3, “Large”.");
  });
});
