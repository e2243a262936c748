import { describe, expect, it } from "vitest";
import { ACCESS, accessRefusal, disputeRefusal, expandScope, may, verdictRefusal, withinScope, type ProofAction, type Standing } from "./rules";

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

  it("filters to the cases in scope; items of no case are whole-proof only", () => {
    const items = [{ c: 1 }, { c: 2 }, { c: null }];
    expect(withinScope(items, (i) => i.c, null)).toEqual(items);
    expect(withinScope(items, (i) => i.c, new Set([2]))).toEqual([{ c: 2 }]);
  });
});
