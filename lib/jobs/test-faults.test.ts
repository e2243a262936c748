import { afterEach, describe, expect, it, vi } from "vitest";
import { faultPoint, InjectedFault } from "./test-faults";

afterEach(() => vi.unstubAllEnvs());

describe("faults injected on purpose (tests only)", () => {
  it("throw at exactly the named attempts of the named parts", () => {
    vi.stubEnv("NODE_ENV", "test");
    vi.stubEnv("CAIRN_TEST_FAULTS", "part:2@1,part:3@*");
    expect(() => faultPoint(2, 1)).toThrow(InjectedFault);
    expect(() => faultPoint(2, 1)).toThrow("fault injected by CAIRN_TEST_FAULTS into part 2, attempt 1");
    expect(() => faultPoint(2, 2)).not.toThrow();
    expect(() => faultPoint(1, 1)).not.toThrow();
    for (const attempt of [1, 2, 3]) expect(() => faultPoint(3, attempt)).toThrow(InjectedFault);
  });

  it("do nothing outside the tests, whatever the setting says", () => {
    vi.stubEnv("NODE_ENV", "production");
    vi.stubEnv("CAIRN_TEST_FAULTS", "part:1@*");
    expect(() => faultPoint(1, 1)).not.toThrow();
  });
});
