/**
 * The health route's own database connection. A probe answered through the application's pool
 * would wait behind busy requests and report a slow database when only the pool is full; one
 * long-lived connection, opened again after any error, measures the database itself.
 */
import * as mariadb from "mariadb";
import { databaseUrl } from "./env";

const g = globalThis as unknown as { __cairnHealthConnection?: Promise<mariadb.Connection> };

function connection(timeoutMs: number): Promise<mariadb.Connection> {
  g.__cairnHealthConnection ??= (async () => {
    const url = new URL(databaseUrl());
    const conn = await mariadb.createConnection({
      host: url.hostname,
      port: Number(url.port) || 3306,
      user: decodeURIComponent(url.username),
      password: decodeURIComponent(url.password),
      database: url.pathname.slice(1) || undefined,
      connectTimeout: timeoutMs,
    });
    conn.on("error", () => forget(conn));
    conn.on("end", () => forget(conn));
    return conn;
  })();
  // A failed connect is forgotten, so the next probe tries again.
  g.__cairnHealthConnection.catch(() => (g.__cairnHealthConnection = undefined));
  return g.__cairnHealthConnection;
}

function forget(conn: mariadb.Connection): void {
  void g.__cairnHealthConnection?.then(
    (c) => {
      if (c === conn) g.__cairnHealthConnection = undefined;
    },
    () => undefined,
  );
}

/**
 * Runs `SELECT 1` on the health connection and returns the round trip in ms; rejects with a message
 * a person can act on when the database does not answer within `timeoutMs`.
 */
export async function pingDatabase(timeoutMs = 3_000): Promise<number> {
  const t0 = performance.now();
  let timer: ReturnType<typeof setTimeout> | undefined;
  const late = new Promise<never>((_, reject) => (timer = setTimeout(() => reject(new Error(`no answer within ${timeoutMs / 1000} s`)), timeoutMs)));
  try {
    const conn = await Promise.race([connection(timeoutMs), late]);
    await Promise.race([conn.query("SELECT 1"), late]).catch(async (e) => {
      forget(conn);
      await conn.end().catch(() => conn.destroy());
      throw e;
    });
    return performance.now() - t0;
  } finally {
    clearTimeout(timer);
  }
}

/** For tests and scripts: close the health connection. */
export async function closeHealthConnection(): Promise<void> {
  const pending = g.__cairnHealthConnection;
  g.__cairnHealthConnection = undefined;
  const conn = await pending?.catch(() => undefined);
  await conn?.end().catch(() => conn.destroy());
}
