import { describe, expect, it } from "vitest";
import { canMoveDispute, disputeRefusal, expandScope, verdictRefusal } from "./rules";

describe("dispute transitions", () => {
  it("follow raised → answered → withdrawn or upheld", () => {
    expect(canMoveDispute("raised", "answered")).toBe(true);
    expect(canMoveDispute("answered", "withdrawn")).toBe(true);
    expect(canMoveDispute("answered", "upheld")).toBe(true);
    expect(canMoveDispute("upheld", "answered")).toBe(true);
    expect(canMoveDispute("withdrawn", "upheld")).toBe(true);
    expect(canMoveDispute("withdrawn", "answered")).toBe(false);
    expect(canMoveDispute("raised", "upheld")).toBe(false);
    expect(canMoveDispute(null, "withdrawn")).toBe(false);
  });
});

describe("permissions", () => {
  it("lets only an in-scope reviewer who did not write the step give a verdict", () => {
    expect(verdictRefusal({ id: 1, role: "reviewer" }, [2], true)).toBeNull();
    expect(verdictRefusal({ id: 1, role: "editor" }, [2], true)).toMatch(/Only invited reviewers/);
    expect(verdictRefusal({ id: 2, role: "reviewer" }, [2], true)).toMatch(/own step/);
    expect(verdictRefusal({ id: 1, role: "reviewer" }, [2], false)).toMatch(/not asked to review/);
  });

  it("lets authors answer and the disputing reviewer or an editor close or reopen", () => {
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
