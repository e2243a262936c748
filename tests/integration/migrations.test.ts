/** Migrations go up and all the way down again, on a database of their own. */
import { afterAll, describe, expect, it } from "vitest";
import { QueryTypes, Sequelize } from "sequelize";
import compat from "@/lib/mariadb-compat";
import { createMigrator } from "@/lib/migrator";

const url = process.env.CAIRN_MIGRATIONS_DATABASE_URL;
const sq = new Sequelize(url ?? "mariadb://invalid@127.0.0.1:1/none", { dialect: "mariadb", dialectModule: compat, logging: false });

afterAll(async () => {
  await sq.close();
});

const tables = async () =>
  (await sq.query<{ t: string }>("SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE()", { type: QueryTypes.SELECT }))
    .map((r) => r.t)
    .filter((t) => !t.toLowerCase().startsWith("sequelize"))
    .sort();

describe("migrations", () => {
  it("has a migrations database from npm test", () => {
    expect(url, "run through npm test, which sets CAIRN_MIGRATIONS_DATABASE_URL").toBeTruthy();
  });

  it("apply on an empty database, roll back to nothing, and apply again", async () => {
    const migrator = createMigrator(sq);
    await migrator.up();
    const afterUp = await tables();
    expect(afterUp).toEqual(
      expect.arrayContaining(["users", "proofs", "proof_members", "cases", "steps", "step_revisions", "claims", "reviews", "comments", "audit_events"]),
    );
    const engines = await sq.query<{ e: string; c: string }>(
      "SELECT engine AS e, table_collation AS c FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name NOT LIKE 'sequelize%'",
      { type: QueryTypes.SELECT },
    );
    for (const row of engines) {
      expect(row.e).toBe("InnoDB");
      expect(row.c).toMatch(/^utf8mb4/);
    }
    await migrator.down({ to: 0 });
    expect(await tables()).toEqual([]);
    await migrator.up();
    expect(await tables()).toEqual(afterUp);
  });

  it("runs raw SELECTs and column removal through the connector fix", async () => {
    // The connector fix is about exactly these two operations (see lib/mariadb-compat.ts).
    const qi = sq.getQueryInterface();
    await qi.addColumn("proofs", "scratch_note", { type: "VARCHAR(10)", allowNull: true });
    await qi.removeColumn("proofs", "scratch_note");
    const [row] = await sq.query<{ one: number }>("SELECT 1 AS one", { type: QueryTypes.SELECT });
    expect(Number(row.one)).toBe(1);
    const raw = await sq.query("SELECT 2 AS two");
    expect(Array.isArray(raw[0])).toBe(true);
  });
});
