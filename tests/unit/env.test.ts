import { describe, expect, it } from "vitest";
import { EnvError, checkServerEnv, readEnv } from "@/lib/env";

describe("settings from the environment", () => {
  it("gives defaults and reads numbers", () => {
    const env = readEnv({ CAIRN_SMTP_PORT: "2600", CAIRN_VERIFY_TIME_LIMIT_MS: "5000" });
    expect(env.CAIRN_SMTP_PORT).toBe(2600);
    expect(env.CAIRN_VERIFY_TIME_LIMIT_MS).toBe(5000);
    expect(env.CAIRN_VERIFY_STEP_LIMIT).toBe(200_000_000);
    expect(readEnv({}).CAIRN_SMTP_PORT).toBe(2525);
  });

  it("names every bad variable and what it should look like", () => {
    let error: unknown;
    try {
      readEnv({ DATABASE_URL: "postgres://x@h/db", CAIRN_SMTP_PORT: "seventy", SMTP_URL: "http://mail" });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(EnvError);
    const message = (error as Error).message;
    expect(message).toMatch(/DATABASE_URL: must look like mariadb:\/\/user:password@host:port\/database/);
    expect(message).toMatch(/CAIRN_SMTP_PORT:/);
    expect(message).toMatch(/SMTP_URL: must look like smtp:\/\/host:port/);
    expect(message).toMatch(/README/);
  });

  it("reads an empty value as unset", () => {
    expect(readEnv({ DATABASE_URL: "" }).DATABASE_URL).toBeUndefined();
  });

  it("refuses to start a server without a database or a signing key", () => {
    expect(() => checkServerEnv({ NEXTAUTH_SECRET: "x".repeat(32) })).toThrow(/DATABASE_URL: not set/);
    expect(() => checkServerEnv({ DATABASE_URL: "mariadb://a:b@127.0.0.1:3307/cairn" })).toThrow(/NEXTAUTH_SECRET: not set/);
    expect(() => checkServerEnv({ DATABASE_URL: "mariadb://a:b@127.0.0.1:3307/cairn", NEXTAUTH_SECRET: "short" })).toThrow(/NEXTAUTH_SECRET: must be at least 16/);
    expect(checkServerEnv({ DATABASE_URL: "mariadb://a:b@127.0.0.1:3307/cairn", NEXTAUTH_SECRET: "x".repeat(32) }).DATABASE_URL).toContain("3307");
  });
});
