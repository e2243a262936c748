import { describe, expect, it } from "vitest";
import { caseNumbers, casesBelow, numberedCases } from "@/lib/proof-tree";
import { expandScope } from "@/lib/access/rules";
import fc from "fast-check";

// The one definition of "a case and everything below it": a referee's scope, the cases a deletion
// hides and what a deleted case holds all use it (common practice: the descendant closure of a forest).
const rows = [
  { id: 1, parentId: null },
  { id: 2, parentId: 1 },
  { id: 3, parentId: 2 },
  { id: 4, parentId: null },
  { id: 5, parentId: 4 },
  { id: 6, parentId: 1 },
];

describe("casesBelow", () => {
  it("holds the roots and every descendant, nothing else", () => {
    expect([...casesBelow([2], rows)].sort()).toEqual([2, 3]);
    expect([...casesBelow([1], rows)].sort()).toEqual([1, 2, 3, 6]);
    expect([...casesBelow([3, 5], rows)].sort()).toEqual([3, 5]);
    expect(casesBelow([], rows).size).toBe(0);
  });

  it("ends on broken data with a cycle of parents", () => {
    const cyclic = [
      { id: 1, parentId: 2 },
      { id: 2, parentId: 1 },
    ];
    expect([...casesBelow([1], cyclic)].sort()).toEqual([1, 2]);
  });

  it("a referee's scope is the whole proof when no case is named, else the closure", () => {
    expect(expandScope([], rows)).toBeNull();
    expect([...expandScope([4], rows)!].sort()).toEqual([4, 5]);
  });

  it("agrees with walking each case's ancestors on random forests", () => {
    fc.assert(
      fc.property(fc.array(fc.nat(20), { minLength: 1, maxLength: 30 }), fc.array(fc.nat(29), { maxLength: 4 }), (parents, roots) => {
        // Case i+1 has parent parents[i] when that names an earlier case, so the rows form a forest.
        const forest = parents.map((p, i) => ({ id: i + 1, parentId: p >= 1 && p <= i ? p : null }));
        const got = casesBelow(roots, forest);
        const parentOf = new Map(forest.map((r) => [r.id, r.parentId]));
        for (const r of forest) {
          let at: number | null = r.id,
            inside = false;
          while (at !== null) {
            if (roots.includes(at)) inside = true;
            at = parentOf.get(at) ?? null;
          }
          expect(got.has(r.id)).toBe(inside);
        }
      }),
    );
  });
});

// Numbers a case by its place among its siblings, at every depth (common practice: outline numbering).
describe("numberedCases and caseNumbers", () => {
  // A stand-in for a model instance: its columns are getters on the prototype, so a spread would copy nothing.
  class Row {
    constructor(private readonly v: { id: number; parentId: number | null; position: number; title: string }) {}
    get id() {
      return this.v.id;
    }
    get parentId() {
      return this.v.parentId;
    }
    get position() {
      return this.v.position;
    }
    get title() {
      return this.v.title;
    }
  }
  const instances = [
    new Row({ id: 10, parentId: null, position: 2, title: "Two" }),
    new Row({ id: 11, parentId: null, position: 1, title: "One" }),
    new Row({ id: 12, parentId: 10, position: 1, title: "Two, first" }),
    new Row({ id: 13, parentId: 12, position: 5, title: "Deep" }),
  ];

  it("reads model-like rows field by field and numbers them in reading order", () => {
    expect(numberedCases(instances).map((n) => [n.number, n.id, n.title])).toEqual([
      ["1", 11, "One"],
      ["2", 10, "Two"],
      ["2.1", 12, "Two, first"],
      ["2.1.1", 13, "Deep"],
    ]);
    expect([...caseNumbers(instances)].sort((a, b) => a[0] - b[0])).toEqual([
      [10, "2"],
      [11, "1"],
      [12, "2.1"],
      [13, "2.1.1"],
    ]);
  });
});
