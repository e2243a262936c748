import { describe, expect, it } from "vitest";
import { canMoveDispute } from "./rules";

describe("dispute transitions", () => {
  it("follow open → answered → closed or reopened", () => {
    expect(canMoveDispute("open", "answered")).toBe(true);
    expect(canMoveDispute("answered", "closed")).toBe(true);
    expect(canMoveDispute("answered", "reopened")).toBe(true);
    expect(canMoveDispute("reopened", "answered")).toBe(true);
    expect(canMoveDispute("closed", "reopened")).toBe(true);
    expect(canMoveDispute("closed", "answered")).toBe(false);
    expect(canMoveDispute("open", "reopened")).toBe(false);
    expect(canMoveDispute(null, "closed")).toBe(false);
  });
});
