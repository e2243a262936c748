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
    expect(() => checkServerEnv({ DATABASE_URL: "mariadb://a:b@127.0.0.1:3307/cairn", NEXTAUTH_SECRET: "short" })).toThrow(
      /NEXTAUTH_SECRET: must be at least 16/,
    );
    expect(checkServerEnv({ DATABASE_URL: "mariadb://a:b@127.0.0.1:3307/cairn", NEXTAUTH_SECRET: "x".repeat(32) }).DATABASE_URL).toContain("3307");
  });
});

describe("storage settings", () => {
  it("default to local disk and read the S3 settings", () => {
    expect(readEnv({}).CAIRN_STORAGE).toBe("local");
    expect(readEnv({}).CAIRN_UPLOAD_MAX_BYTES).toBe(64 * 1024 * 1024);
    const env = readEnv({ CAIRN_STORAGE: "s3", CAIRN_S3_BUCKET: "proof-files", CAIRN_S3_ENDPOINT: "http://127.0.0.1:9000", CAIRN_S3_PATH_STYLE: "true" });
    expect(env).toMatchObject({ CAIRN_STORAGE: "s3", CAIRN_S3_BUCKET: "proof-files", CAIRN_S3_PATH_STYLE: true });
  });

  it("name what is wrong with them", () => {
    expect(() => readEnv({ CAIRN_STORAGE: "s3" })).toThrow(/CAIRN_S3_BUCKET: not set; CAIRN_STORAGE=s3 needs the bucket/);
    expect(() => readEnv({ CAIRN_STORAGE: "s3", CAIRN_S3_BUCKET: "Bad_Bucket" })).toThrow(/CAIRN_S3_BUCKET: must be an S3 bucket name/);
    expect(() => readEnv({ CAIRN_S3_ENDPOINT: "not a url" })).toThrow(/CAIRN_S3_ENDPOINT: must be the service's URL/);
    expect(() => readEnv({ CAIRN_UPLOAD_MAX_BYTES: "-3" })).toThrow(/CAIRN_UPLOAD_MAX_BYTES/);
  });
});

describe("the test-only fault setting", () => {
  it("is read under NODE_ENV=test only, and refused elsewhere with what to do", () => {
    expect(readEnv({ NODE_ENV: "test", CAIRN_TEST_FAULTS: "part:2@1,part:3@*" }).CAIRN_TEST_FAULTS).toBe("part:2@1,part:3@*");
    expect(() => readEnv({ NODE_ENV: "production", CAIRN_TEST_FAULTS: "part:2@1" })).toThrow(
      /CAIRN_TEST_FAULTS: makes verification fail on purpose .* unset it/,
    );
    expect(() => readEnv({ CAIRN_TEST_FAULTS: "part:2@1" })).toThrow(/here unset/);
    expect(() => readEnv({ NODE_ENV: "test", CAIRN_TEST_FAULTS: "part:0@1" })).toThrow(/must be a comma-separated list like "part:2@1"/);
  });
});
