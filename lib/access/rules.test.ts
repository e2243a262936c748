import { describe, expect, it } from "vitest";
import {
  ACCESS,
  accessRefusal,
  disputeRefusal,
  expandScope,
  invitationRefusal,
  may,
  mayOwn,
  removalRefusal,
  verdictRefusal,
  withinScope,
  type ProofAction,
  type Standing,
} from "./rules";

describe("permissions", () => {
  it("lets only an in-scope reviewer who did not write the step give a verdict", () => {
    expect(verdictRefusal({ id: 1, role: "reviewer" }, [2], true)).toBeNull();
    expect(verdictRefusal({ id: 1, role: "editor" }, [2], true)).toMatch(/Only invited reviewers/);
    expect(verdictRefusal({ id: 2, role: "reviewer" }, [2], true)).toMatch(/own step/);
    expect(verdictRefusal({ id: 1, role: "reviewer" }, [2], false)).toMatch(/not asked to review/);
  });

  it("lets authors answer and the disputing reviewer or an editor withdraw or uphold", () => {
    expect(disputeRefusal({ id: 5, role: "author" }, 1, "answered")).toBeNull();
    expect(disputeRefusal({ id: 1, role: "reviewer" }, 1, "answered")).toMatch(/authors/);
    expect(disputeRefusal({ id: 1, role: "reviewer" }, 1, "withdrawn")).toBeNull();
    expect(disputeRefusal({ id: 9, role: "editor" }, 1, "upheld")).toBeNull();
    expect(disputeRefusal({ id: 7, role: "reviewer" }, 1, "withdrawn")).toMatch(/raised this dispute/);
    expect(disputeRefusal({ id: 5, role: "author" }, 1, "withdrawn")).toMatch(/raised this dispute/);
  });
});

describe("reviewer scope", () => {
  it("covers the chosen cases and their sub-cases; no cases means the whole proof", () => {
    const cases = [
      { id: 1, parentId: null },
      { id: 2, parentId: null },
      { id: 3, parentId: 2 },
      { id: 4, parentId: 3 },
    ];
    expect(expandScope([], cases)).toBeNull();
    expect([...expandScope([2], cases)!].sort()).toEqual([2, 3, 4]);
  });
});

describe("the access table", () => {
  const s = (role: Standing["role"], extra: Partial<Standing> = {}): Standing => ({ role, owner: false, caseLimited: false, ...extra });

  it("gives authors the writing, editors and the owner the reviewers, reviewers the verdicts", () => {
    expect(may(s("author"), "steps.write")).toBe(true);
    expect(may(s("reviewer"), "steps.write")).toBe(false);
    expect(may(s("editor"), "cases.write")).toBe(false);
    expect(may(s("editor"), "reviewers.manage")).toBe(true);
    expect(may(s("author"), "reviewers.manage")).toBe(false);
    expect(may(s("author", { owner: true }), "reviewers.manage")).toBe(true);
    expect(may(s("reviewer"), "verdict.give")).toBe(true);
    expect(may(s("author"), "verdict.give")).toBe(false);
    expect(accessRefusal(s("reviewer"), "exports.create")).toMatch(/author or an editor/);
  });

  it("refuses every whole-proof action to a case-limited member, and nothing else", () => {
    const limited = s("reviewer", { caseLimited: true });
    for (const action of Object.keys(ACCESS) as ProofAction[]) {
      const whole = ACCESS[action].wholeProof === true;
      if (whole) expect(accessRefusal(limited, action)).toMatch(/some of its cases only/);
      else expect(may(limited, action)).toBe(may(s("reviewer"), action));
    }
  });

  it("lets authors invite co-authors, editors and the owner invite editors and referees, and only the owner hand over ownership", () => {
    expect(invitationRefusal(s("author"), "author", false)).toBeNull();
    expect(invitationRefusal(s("reviewer"), "author", false)).toMatch(/co-authors/);
    expect(invitationRefusal(s("author"), "editor", false)).toMatch(/invites editors/);
    expect(invitationRefusal(s("author", { owner: true }), "editor", false)).toBeNull();
    expect(invitationRefusal(s("editor"), "reviewer", true)).toBeNull();
    expect(invitationRefusal(s("author", { owner: true }), "reviewer", false)).toBeNull();
    expect(invitationRefusal(s("author", { owner: true }), "reviewer", true)).toMatch(/refereed blind/);
    expect(may(s("editor"), "ownership.transfer")).toBe(false);
    expect(may(s("author", { owner: true }), "ownership.transfer")).toBe(true);
    expect([mayOwn("author"), mayOwn("editor"), mayOwn("reviewer")]).toEqual([true, true, false]);
  });

  it("lets anyone leave, editors and the owner remove others, and keeps a blind proof's referees to its editors", () => {
    const referee = { userId: 7, role: "reviewer" as const };
    expect(removalRefusal(s("reviewer"), 7, referee, true)).toBeNull(); // leaving
    expect(removalRefusal(s("author"), 1, { userId: 2, role: "author" }, false)).toMatch(/removes members/);
    expect(removalRefusal(s("author", { owner: true }), 1, referee, false)).toBeNull();
    expect(removalRefusal(s("author", { owner: true }), 1, referee, true)).toMatch(/refereed blind/);
    expect(removalRefusal(s("editor"), 1, referee, true)).toBeNull();
  });

  it("filters to the cases in scope; items of no case are whole-proof only", () => {
    const items = [{ c: 1 }, { c: 2 }, { c: null }];
    expect(withinScope(items, (i) => i.c, null)).toEqual(items);
    expect(withinScope(items, (i) => i.c, new Set([2]))).toEqual([{ c: 2 }]);
  });
});
