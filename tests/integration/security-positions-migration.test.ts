/**
 * Migration 0007 carries over positions written twice by racing creates before the unique index
 * existed: a case or step holding a duplicate is renumbered 1..k in (position, id) order; others are
 * left as they are. Runs on the migrations database of its own.
 */
import { afterAll, describe, expect, it } from "vitest";
import { QueryTypes, Sequelize } from "sequelize";
import compat from "@/lib/mariadb-compat";
import { createMigrator } from "@/lib/migrator";

const url = process.env.CAIRN_MIGRATIONS_DATABASE_URL;
const sq = new Sequelize(url ?? "mariadb://invalid@127.0.0.1:1/none", { dialect: "mariadb", dialectModule: compat, logging: false });

afterAll(async () => {
  await sq.close();
});

const insert = async (sql: string, values: unknown[]) => {
  const [id] = await sq.query(sql, { replacements: values, type: QueryTypes.INSERT });
  return Number(id);
};
const places = async (table: string, parent: string, id: number) =>
  (
    await sq.query<{ id: number; position: number }>(`SELECT id, position FROM ${table} WHERE ${parent} = ? ORDER BY id`, {
      replacements: [id],
      type: QueryTypes.SELECT,
    })
  ).map((r) => Number(r.position));

describe("migration 0007 (unique positions)", () => {
  it("renumbers duplicate step and claim positions, keeps the rest, and then refuses a duplicate", async () => {
    const migrator = createMigrator(sq);
    await migrator.up();
    await migrator.down({ to: "0007-unique-positions-session-version.ts" });
    const user = await insert(
      "INSERT INTO users (email, name, role, created_at, updated_at) VALUES ('mig-0007@tarnhollow.example', 'Migration Test', 'member', NOW(3), NOW(3))",
      [],
    );
    const proof = await insert("INSERT INTO proofs (title, statement, created_by, created_at, updated_at) VALUES ('P', 'S', ?, NOW(3), NOW(3))", [user]);
    const caseA = await insert(
      "INSERT INTO cases (proof_id, parent_id, position, title, `condition`, created_at, updated_at) VALUES (?, NULL, 1, 'A', '', NOW(3), NOW(3))",
      [proof],
    );
    const caseB = await insert(
      "INSERT INTO cases (proof_id, parent_id, position, title, `condition`, created_at, updated_at) VALUES (?, NULL, 2, 'B', '', NOW(3), NOW(3))",
      [proof],
    );
    const stepsA = [];
    for (const p of [1, 2, 2, 1, 3]) stepsA.push(await insert("INSERT INTO steps (case_id, position, created_at) VALUES (?, ?, NOW(3))", [caseA, p]));
    for (const p of [1, 3]) await insert("INSERT INTO steps (case_id, position, created_at) VALUES (?, ?, NOW(3))", [caseB, p]);
    for (const p of [1, 1, 1])
      await insert(
        "INSERT INTO claims (step_id, position, kind, input, created_by, created_at, updated_at) VALUES (?, ?, 'subgraph', '{}', ?, NOW(3), NOW(3))",
        [stepsA[0], p, user],
      );

    await migrator.up();
    // (position, id) order: ids 0 and 3 at place 1, ids 1 and 2 at place 2, id 4 at place 3.
    expect(await places("steps", "case_id", caseA)).toEqual([1, 3, 4, 2, 5]);
    expect(await places("steps", "case_id", caseB)).toEqual([1, 3]); // no duplicate: untouched
    expect(await places("claims", "step_id", stepsA[0])).toEqual([1, 2, 3]);
    await expect(insert("INSERT INTO steps (case_id, position, created_at) VALUES (?, 1, NOW(3))", [caseB])).rejects.toMatchObject({
      name: "SequelizeUniqueConstraintError",
    });
    const [u] = await sq.query<{ v: number }>("SELECT session_version AS v FROM users WHERE id = ?", { replacements: [user], type: QueryTypes.SELECT });
    expect(Number(u.v)).toBe(1);
    await sq.query("DELETE FROM proofs WHERE id = ?", { replacements: [proof] });
    await sq.query("DELETE FROM users WHERE id = ?", { replacements: [user] });
  });
});
