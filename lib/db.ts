/**
 * The one Sequelize instance of a process, created lazily. Creating it does not connect, so importing
 * this module during `next build` is harmless even without a database.
 */
import { ConnectionError, Sequelize } from "sequelize";
import compat from "./mariadb-compat";
import { databaseUrl } from "./env";

export { databaseUrl };

const g = globalThis as unknown as { __cairnSequelize?: Sequelize };

export function getSequelize(): Sequelize {
  g.__cairnSequelize ??= new Sequelize(databaseUrl(), {
    dialect: "mariadb",
    dialectModule: compat,
    logging: false,
    pool: { max: 10, min: 0, idle: 10_000 },
    dialectOptions: { connectTimeout: 5_000 },
    define: { underscored: true },
  });
  return g.__cairnSequelize;
}

/** For scripts and tests: close and forget the instance. */
export async function closeSequelize(): Promise<void> {
  const sq = g.__cairnSequelize;
  g.__cairnSequelize = undefined;
  if (sq) await sq.close();
}

// Connector error codes that mean the database is not there (or went away mid-query), not that the
// query was wrong: connection refused or cut, the pool could not get a connection in time.
const GONE_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENOTFOUND",
  "EPIPE",
  "ER_SOCKET_UNEXPECTED_CLOSE",
  "ER_CONNECTION_TIMEOUT",
  "ER_GET_CONNECTION_TIMEOUT",
  "ER_CMD_CONNECTION_CLOSED",
  "ER_CONNECTION_ALREADY_CLOSED",
  "ER_POOL_ALREADY_CLOSED",
  "ER_SERVER_SHUTDOWN",
  "ER_CON_COUNT_ERROR",
]);

/**
 * True when an error means the database is unreachable for now (an outage, a restart, a full
 * server), so the caller should answer 503 and let the client try again, rather than 500.
 */
export function isDatabaseUnavailable(e: unknown): boolean {
  for (let cur = e, depth = 0; cur && typeof cur === "object" && depth < 5; depth++) {
    if (cur instanceof ConnectionError) return true; // refused, timed out, host unreachable, no connection from the pool
    const err = cur as { name?: string; code?: string; fatal?: boolean; parent?: unknown; original?: unknown; cause?: unknown };
    if (err.code && GONE_CODES.has(err.code)) return true;
    if (err.fatal === true && err.name === "SqlError") return true; // the connector's "this connection is dead"
    cur = err.parent ?? err.original ?? err.cause;
  }
  return false;
}
