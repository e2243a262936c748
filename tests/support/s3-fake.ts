/**
 * An S3-compatible fake on loopback for the tests of the S3 storage driver: s3rver (npm), with its
 * files in a throwaway folder. The bucket is created by the fake itself at start.
 */
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import S3rver from "s3rver";

export interface S3Fake {
  endpoint: string;
  bucket: string;
  /** Settings for lib/env.ts / storeFromEnv that point at this fake. */
  env: Record<string, string>;
  stop(): Promise<void>;
}

export async function startS3Fake(port: number, bucket = "cairn-test-files"): Promise<S3Fake> {
  const directory = await mkdtemp(path.join(tmpdir(), "cairn-s3-"));
  const server = new S3rver({ port, address: "127.0.0.1", silent: true, directory, configureBuckets: [{ name: bucket, configs: [] }] });
  await server.run();
  const endpoint = `http://127.0.0.1:${port}`;
  return {
    endpoint,
    bucket,
    // s3rver's fixed credentials (its README): access key S3RVER, secret S3RVER.
    env: {
      CAIRN_STORAGE: "s3",
      CAIRN_S3_BUCKET: bucket,
      CAIRN_S3_ENDPOINT: endpoint,
      CAIRN_S3_PATH_STYLE: "true",
      CAIRN_S3_ACCESS_KEY_ID: "S3RVER",
      CAIRN_S3_SECRET_ACCESS_KEY: "S3RVER",
    },
    async stop() {
      await server.close();
      await rm(directory, { recursive: true, force: true });
    },
  };
}

/**
 * The port of an S3 fake: CAIRN_TEST_S3_PORT (+ offset), else the test database's port + 200 + offset.
 * The unit and the integration tests may run at the same time, so each takes its own offset.
 */
export const s3FakePort = (offset = 0): number => (Number(process.env.CAIRN_TEST_S3_PORT) || (Number(process.env.CAIRN_TEST_DB_PORT) || 3317) + 200) + offset;

/** Every setting that chooses the file store. */
export const STORAGE_KEYS = [
  "CAIRN_STORAGE",
  "CAIRN_STORAGE_DIR",
  "CAIRN_S3_BUCKET",
  "CAIRN_S3_ENDPOINT",
  "CAIRN_S3_PATH_STYLE",
  "CAIRN_S3_ACCESS_KEY_ID",
  "CAIRN_S3_SECRET_ACCESS_KEY",
];

/** Notes these settings as they are now; the function returned puts them back (for a test file's afterAll). */
export function rememberEnv(keys: string[]): () => void {
  const saved = Object.fromEntries(keys.map((k) => [k, process.env[k]]));
  return () => {
    for (const k of keys)
      if (saved[k] === undefined) delete process.env[k];
      else process.env[k] = saved[k];
  };
}

/** Points this process's file store at the fake (`s3`) or at `localDir` (`local`). */
export function useStore(driver: string, fake: S3Fake, localDir: string): void {
  for (const k of STORAGE_KEYS) delete process.env[k];
  if (driver === "s3") Object.assign(process.env, fake.env);
  else process.env.CAIRN_STORAGE_DIR = localDir;
}
