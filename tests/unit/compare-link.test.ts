import { describe, expect, it } from "vitest";
import { compareQuery, parseCompare } from "@/lib/review/compare-link";

describe("the comparison's address", () => {
  it("reads back what it writes", () => {
    expect(compareQuery(1, 3)).toBe("?compare=1..3#compare");
    const query = new URLSearchParams(compareQuery(2, 5).split("#")[0]);
    expect(parseCompare(query.get("compare")!, 5)).toEqual({ from: 2, to: 5 });
  });

  it("ignores a value that names no two different revisions of the step", () => {
    for (const bad of [undefined, "", "1..1", "0..2", "2..9", "1-2", "a..b", "1..2..3", " 1..2", "1e3..2"])
      expect(parseCompare(bad, 5), String(bad)).toBeNull();
    expect(parseCompare(["1..2", "1..3"], 5)).toBeNull();
    expect(parseCompare("3..1", 3)).toEqual({ from: 3, to: 1 });
  });
});
