import { describe, expect, it } from "vitest";
import { canMoveDispute } from "./rules";

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
