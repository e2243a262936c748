import { describe, expect, it } from "vitest";
import {
  ageInDays,
  isFinalDecision,
  mayDoInRound,
  proofStanding,
  proofStandingText,
  refereeDisplayName,
  refereeStanding,
  remindersDue,
  reportAccess,
} from "./rounds";

const DAY = 86_400_000;
const due = new Date("2026-05-10T12:00:00Z");
const at = (days: number) => new Date(due.getTime() + days * DAY);

describe("round permissions", () => {
  it("gives rounds, due dates, decisions, the desk and the blind setting to editors, and reports to referees only", () => {
    for (const a of ["open_round", "set_due_date", "decide", "read_desk", "set_review_policy"] as const) {
      expect(mayDoInRound("editor", a)).toBe(true);
      expect(mayDoInRound("author", a)).toBe(false);
      expect(mayDoInRound("reviewer", a)).toBe(false);
    }
    expect(mayDoInRound("reviewer", "write_report")).toBe(true);
    expect(mayDoInRound("author", "write_report")).toBe(false);
    expect(mayDoInRound("editor", "write_report")).toBe(false);
  });
  it("treats accept and reject as final, revisions as not", () => {
    expect([isFinalDecision("accept"), isFinalDecision("reject"), isFinalDecision("minor_revision"), isFinalDecision("major_revision")]).toEqual([
      true,
      true,
      false,
      false,
    ]);
  });
});

describe("report access", () => {
  const own = { id: 7, role: "reviewer" as const };
  const other = { id: 8, role: "reviewer" as const };
  const editor = { id: 9, role: "editor" as const };
  const author = { id: 10, role: "author" as const };
  const submitted = { refereeId: 7, submitted: true };
  const draft = { refereeId: 7, submitted: false };
  const open = { decided: false, reportsAttached: true };
  const decided = { decided: true, reportsAttached: true };
  const decidedWithout = { decided: true, reportsAttached: false };
  it("lets the referee read everything of their own, drafts included", () => {
    expect(reportAccess(own, draft, open)).toEqual({ body: true, note: true });
  });
  it("keeps drafts from everyone else, the editor included", () => {
    for (const v of [other, editor, author]) expect(reportAccess(v, draft, decided)).toEqual({ body: false, note: false });
  });
  it("gives the editor-only note to editors and never to another referee or an author", () => {
    expect(reportAccess(editor, submitted, open).note).toBe(true);
    for (const r of [open, decided, decidedWithout]) {
      expect(reportAccess(other, submitted, r).note).toBe(false);
      expect(reportAccess(author, submitted, r).note).toBe(false);
    }
  });
  it("shows authors a submitted report only after a decision that attached it", () => {
    expect(reportAccess(author, submitted, open).body).toBe(false);
    expect(reportAccess(author, submitted, decided).body).toBe(true);
    expect(reportAccess(author, submitted, decidedWithout).body).toBe(false);
    expect(reportAccess(other, submitted, open).body).toBe(false);
    expect(reportAccess(other, submitted, decidedWithout).body).toBe(true);
  });
});

describe("referee names under blind review", () => {
  const base = { viewerId: 1, refereeId: 2, name: "Celia Marwood", index: 3 };
  it("shows authors and other referees 'Referee k' on a blind proof, editors and the referee the name", () => {
    expect(refereeDisplayName({ ...base, viewerRole: "author", blind: true })).toBe("Referee 3");
    expect(refereeDisplayName({ ...base, viewerRole: "reviewer", blind: true })).toBe("Referee 3");
    expect(refereeDisplayName({ ...base, viewerRole: "editor", blind: true })).toBe("Celia Marwood");
    expect(refereeDisplayName({ ...base, viewerRole: "reviewer", blind: true, viewerId: 2 })).toBe("Celia Marwood");
    expect(refereeDisplayName({ ...base, viewerRole: "author", blind: false })).toBe("Celia Marwood");
  });
});

describe("lateness and reminders", () => {
  it("is late only past the due date without a submission, and counts whole days", () => {
    expect(refereeStanding({ dueAt: due, submittedAt: null, hasDraft: false }, at(-1))).toEqual({ progress: "not started", late: false, daysLate: 0 });
    expect(refereeStanding({ dueAt: due, submittedAt: null, hasDraft: true }, at(2.5))).toEqual({ progress: "drafting", late: true, daysLate: 2 });
    expect(refereeStanding({ dueAt: due, submittedAt: at(1), hasDraft: false }, at(3)).progress).toBe("submitted late");
    expect(refereeStanding({ dueAt: due, submittedAt: at(-1), hasDraft: false }, at(3))).toEqual({ progress: "submitted", late: false, daysLate: 0 });
  });
  it("sends 'before' inside the window before the due date and 'after' from the set days after it; 0 turns a kind off", () => {
    expect(remindersDue(due, at(-4), 3, 1)).toEqual([]);
    expect(remindersDue(due, at(-3), 3, 1)).toEqual(["before"]);
    expect(remindersDue(due, at(-0.1), 3, 1)).toEqual(["before"]);
    expect(remindersDue(due, at(0.5), 3, 1)).toEqual([]);
    expect(remindersDue(due, at(1), 3, 1)).toEqual(["after"]);
    expect(remindersDue(due, at(-1), 0, 1)).toEqual([]);
    expect(remindersDue(due, at(5), 3, 0)).toEqual([]);
  });
  it("counts the age of a dispute in whole days, never negative", () => {
    expect(ageInDays(at(0), at(4.9))).toBe(4);
    expect(ageInDays(at(1), at(0))).toBe(0);
  });
});

describe("a proof's standing in the proof list", () => {
  it("reads drafting before any round, in review while the latest round waits for its decision, decided after", () => {
    const text = (rounds: Parameters<typeof proofStanding>[0]) => proofStandingText(proofStanding(rounds));
    expect(text([])).toBe("drafting");
    expect(text([{ number: 1, decision: null }])).toBe("in review, round 1");
    expect(text([{ number: 1, decision: "major_revision" }])).toBe("decided: major revision (round 1)");
    // The latest round by number decides, in whatever order the rows come.
    expect(
      text([
        { number: 2, decision: null },
        { number: 1, decision: "minor_revision" },
      ]),
    ).toBe("in review, round 2");
    expect(
      text([
        { number: 2, decision: "accept" },
        { number: 1, decision: "major_revision" },
      ]),
    ).toBe("decided: accept (round 2)");
  });
});
