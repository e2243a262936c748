import { describe, expect, it } from "vitest";
import { buildCaseTree, compareStepLabels, flattenCaseTree, stepLabel } from "@/lib/proof-tree";

describe("step labels", () => {
  it("separate the case number from the step's place with a colon, so no label names two steps", () => {
    // With a dot, case 2.1's first step would be "2.1.1", the same text as case 2.1.1.
    const cases = flattenCaseTree(
      buildCaseTree([
        { id: 1, parentId: null, position: 1 },
        { id: 2, parentId: null, position: 2 },
        { id: 3, parentId: 2, position: 1 },
        { id: 4, parentId: 3, position: 1 },
      ]),
    );
    expect(cases.map((c) => c.number)).toEqual(["1", "2", "2.1", "2.1.1"]);
    const labels = cases.flatMap((c) => [1, 2, 3].map((place) => stepLabel(c.number, place)));
    expect(labels).toContain("2.1:1");
    expect(new Set(labels).size).toBe(labels.length);
    // Each label reads back to exactly one (case, place).
    for (const c of cases) for (const place of [1, 2, 3]) expect(stepLabel(c.number, place).split(":")).toEqual([c.number, String(place)]);
  });

  it("sort as the proof reads: a case's own steps, then its sub-cases, numbers compared as numbers", () => {
    const shuffled = ["10:1", "2.1:1", "2:2", "1:10", "2.1.1:1", "1:2", "2:1", "2.10:1", "2.2:1"];
    expect([...shuffled].sort(compareStepLabels)).toEqual(["1:2", "1:10", "2:1", "2:2", "2.1:1", "2.1.1:1", "2.2:1", "2.10:1", "10:1"]);
  });
});
