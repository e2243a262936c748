import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { buildCaseTree, compareStepLabels, flattenCaseTree, labelSteps, parseStepLabel, placeLetters, placeOfLetters, stepLabel } from "@/lib/proof-tree";

describe("step labels", () => {
  it("name a step by its case number and a letter in parentheses, so no label names two steps", () => {
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
    expect(labels.slice(0, 3)).toEqual(["1(a)", "1(b)", "1(c)"]);
    expect(labels).toContain("2.1.1(c)");
    expect(new Set(labels).size).toBe(labels.length);
    // Each label reads back to exactly one (case, place).
    for (const c of cases) for (const place of [1, 2, 3]) expect(parseStepLabel(stepLabel(c.number, place))).toEqual({ caseNumber: c.number, place });
  });

  it("go on past (z) as spreadsheet columns do: (aa), (ab) … (az), (ba) … (zz), (aaa)", () => {
    // Bijective base 26, as spreadsheet column names (common practice).
    expect([1, 2, 26, 27, 28, 52, 53, 702, 703].map(placeLetters)).toEqual(["a", "b", "z", "aa", "ab", "az", "ba", "zz", "aaa"]);
    expect(stepLabel("3.2.1", 27)).toBe("3.2.1(aa)");
    for (const bad of [0, -1, 1.5, Number.NaN]) expect(() => placeLetters(bad)).toThrow(RangeError);
    fc.assert(fc.property(fc.integer({ min: 1, max: 10_000_000 }), (n) => placeOfLetters(placeLetters(n)) === n));
    // Distinct places give distinct letters (bijective on 1 … 26 + 26² + 26³).
    const all = Array.from({ length: 26 + 26 ** 2 + 26 ** 3 }, (_x, i) => placeLetters(i + 1));
    expect(new Set(all).size).toBe(all.length);
    expect(all.every((s) => /^[a-z]{1,3}$/.test(s))).toBe(true);
  });

  it("read back only what they write", () => {
    for (const text of ["2.1:1", "2.1(A)", "2.1()", "(a)", "2.(a)", "2.1(a1)", "2.1 (a)", "x(a)", "2.1(a)(b)"]) expect(parseStepLabel(text)).toBeNull();
    expect(parseStepLabel("10.2(zz)")).toEqual({ caseNumber: "10.2", place: 702 });
  });

  it("sort as the proof reads: a case's own steps, then its sub-cases, numbers compared as numbers", () => {
    const shuffled = ["10(a)", "2.1(a)", "2(b)", "1(aa)", "2.1.1(a)", "1(b)", "2(a)", "2.10(a)", "2.2(a)", "1(z)"];
    expect([...shuffled].sort(compareStepLabels)).toEqual(["1(b)", "1(z)", "1(aa)", "2(a)", "2(b)", "2.1(a)", "2.1.1(a)", "2.2(a)", "2.10(a)", "10(a)"]);
  });

  const step = (id: number, caseId: number, position: number) => ({ id, caseId, position });
  const entries = (labels: Record<number, string | undefined>) => Object.entries(labels).map(([id, label]) => [Number(id), label]);
  it.each([
    // Ranks 3 and 7 in case 1 give (a) and (b), whatever order the steps come in; a step of a case outside the tree gets no label.
    { cases: { 1: "1", 2: "1.1" }, steps: [step(11, 1, 7), step(10, 1, 3), step(20, 2, 1), step(30, 9, 1)], labels: { 10: "1(a)", 11: "1(b)", 20: "1.1(a)" } },
    // The timeline's labels (lib/review/event-sentences) come from here too: the same as the case tree and the step page.
    { cases: { 1: "1", 2: "2.1" }, steps: [step(10, 1, 3), step(11, 1, 7), step(12, 2, 2)], labels: { 10: "1(a)", 11: "1(b)", 12: "2.1(a)" } },
  ])("follow each step's rank in its case, not its stored position: $labels", ({ cases, steps, labels }) => {
    expect([...labelSteps(new Map(entries(cases) as Array<[number, string]>), steps)]).toEqual(entries(labels));
  });
});
