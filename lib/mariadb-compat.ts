/**
 * The mariadb connector with one fix for Sequelize 6.
 *
 * mariadb 3.1+ returns result arrays with a non-configurable `meta` property, and Sequelize 6
 * deletes that property after every raw query, which throws "Cannot delete property 'meta'".
 * We re-attach `meta` as configurable on a copy. (Pinning mariadb 3.0.2 also works; we prefer the
 * current connector with a narrow wrapper, tested by a raw SELECT and a removeColumn round trip.)
 */
import * as mariadb from "mariadb";

function configurableMeta<T>(result: T): T {
  const d = Array.isArray(result) ? Object.getOwnPropertyDescriptor(result, "meta") : undefined;
  if (!d || d.configurable) return result;
  const copy = (result as unknown as unknown[]).slice();
  Object.defineProperty(copy, "meta", { value: d.value, writable: true, configurable: true });
  return copy as T;
}

const compat = {
  ...mariadb,
  async createConnection(options: mariadb.ConnectionConfig) {
    const conn = await mariadb.createConnection(options);
    const query = conn.query.bind(conn) as (...args: unknown[]) => Promise<unknown>;
    (conn as unknown as { query: unknown }).query = async (...args: unknown[]) => configurableMeta(await query(...args));
    return conn;
  },
};

export default compat;
