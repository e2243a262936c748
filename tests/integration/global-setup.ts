/** Integration tests run against the real MariaDB that `npm test` started: migrate and seed it once. */
import { getSequelize, closeSequelize } from "@/lib/db";
import { createMigrator, createSeeder } from "@/lib/migrator";

export default async function setup() {
  if (!process.env.DATABASE_URL?.includes("cairn_it"))
    throw new Error("Integration tests need the test database; run them through `npm test`, which starts MariaDB and sets DATABASE_URL.");
  const sq = getSequelize();
  await createMigrator(sq).up();
  await createSeeder(sq).up();
  await closeSequelize();
}
