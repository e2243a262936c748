/**
 * Migration 0012-vouch2 carries the words of stored notifications from the old step labels ("2.1:3")
 * to the letters the pages now print ("2.1(c)", lib/proof-tree.ts), and back on the way down. Runs on
 * the migrations database of its own.
 */
import { afterAll, describe, expect, it } from "vitest";
import { QueryTypes, Sequelize } from "sequelize";
import compat from "@/lib/mariadb-compat";
import { createMigrator } from "@/lib/migrator";
import { stepLabel } from "@/lib/proof-tree";

const url = process.env.CAIRN_MIGRATIONS_DATABASE_URL;
const sq = new Sequelize(url ?? "mariadb://invalid@127.0.0.1:1/none", { dialect: "mariadb", dialectModule: compat, logging: false });
const NAME = "0012-vouch2-step-letters.ts";

afterAll(async () => {
  await sq.close();
});

const insert = async (sql: string, values: unknown[]) => {
  const [id] = await sq.query(sql, { replacements: values, type: QueryTypes.INSERT });
  return Number(id);
};
const messages = async (ids: number[]) =>
  (await sq.query<{ message: string }>("SELECT message FROM notifications WHERE id IN (?) ORDER BY id", { replacements: [ids], type: QueryTypes.SELECT })).map(
    (r) => r.message,
  );

describe("migration 0012-vouch2 (step letters)", () => {
  it("rewrites every step label in stored notifications, leaves other words alone, and rolls back", async () => {
    const migrator = createMigrator(sq);
    await migrator.up();
    await migrator.down({ to: NAME });
    const user = await insert(
      "INSERT INTO users (email, name, role, created_at, updated_at) VALUES ('mig-0012-vouch2@tarnhollow.example', 'Migration Test', 'member', NOW(3), NOW(3))",
      [],
    );
    const before = [
      "Your vouch for step 2.1:1 (case 2.1, “Legs 1 and 2”) of “Trees: 3:2 ratio” at revision 1 is superseded by revision 2: text changed.",
      "A referee raised a dispute on revision 3 of step 3.2.1:27 (case 3.2.1, “Long”) of “P”, a step you are an author of.",
      "The dispute on step 10:2 (case 10, “X”) of “P” was withdrawn. Step 1:3 is next.",
      "You are now a referee of “Ratios 1:2 and 2:3”.",
    ];
    const ids = [];
    for (const m of before)
      ids.push(await insert("INSERT INTO notifications (user_id, kind, message, created_at) VALUES (?, 'vouch_superseded', ?, NOW(3))", [user, m]));

    await migrator.up();
    expect(await messages(ids)).toEqual([
      `Your vouch for step ${stepLabel("2.1", 1)} (case 2.1, “Legs 1 and 2”) of “Trees: 3:2 ratio” at revision 1 is superseded by revision 2: text changed.`,
      `A referee raised a dispute on revision 3 of step ${stepLabel("3.2.1", 27)} (case 3.2.1, “Long”) of “P”, a step you are an author of.`,
      `The dispute on step ${stepLabel("10", 2)} (case 10, “X”) of “P” was withdrawn. Step ${stepLabel("1", 3)} is next.`,
      "You are now a referee of “Ratios 1:2 and 2:3”.",
    ]);
    // The letters this migration wrote are the ones the pages print.
    expect(stepLabel("3.2.1", 27)).toBe("3.2.1(aa)");

    await migrator.down({ to: NAME });
    expect(await messages(ids)).toEqual(before);
    await migrator.up();
    await sq.query("DELETE FROM notifications WHERE user_id = ?", { replacements: [user] });
    await sq.query("DELETE FROM users WHERE id = ?", { replacements: [user] });
  });
});
