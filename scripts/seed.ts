/** `tsx scripts/seed.ts`: runs the demo seeders that have not run yet on DATABASE_URL. */
import { getSequelize, closeSequelize } from "../lib/db";
import { createSeeder } from "../lib/migrator";

try {
  const done = await createSeeder(getSequelize()).up();
  console.log(done.length ? `seeded ${done.map((m) => m.name).join(", ")}` : "demo already seeded");
} catch (e) {
  console.error(`seeding failed: ${(e as Error).message}`);
  process.exitCode = 1;
} finally {
  await closeSequelize();
}
