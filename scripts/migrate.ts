/** `tsx scripts/migrate.ts up|down [--to NAME|0]`: applies or rolls back migrations on DATABASE_URL. */
import { getSequelize, closeSequelize } from "../lib/db";
import { createMigrator } from "../lib/migrator";

const [cmd = "up", flag, target] = process.argv.slice(2);
const migrator = createMigrator(getSequelize());
try {
  if (cmd === "up") {
    const done = await migrator.up();
    console.log(done.length ? `applied ${done.map((m) => m.name).join(", ")}` : "schema is up to date");
  } else if (cmd === "down") {
    const to = flag === "--to" ? (target === "0" ? 0 : target) : undefined;
    const done = await migrator.down(to === undefined ? undefined : { to: to as never });
    console.log(done.length ? `rolled back ${done.map((m) => m.name).join(", ")}` : "nothing to roll back");
  } else {
    console.error(`unknown command "${cmd}"; use up or down`);
    process.exitCode = 2;
  }
} catch (e) {
  console.error(`migration failed: ${(e as Error).message}`);
  process.exitCode = 1;
} finally {
  await closeSequelize();
}
