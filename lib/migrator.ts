/** Umzug over the project's TypeScript migrations (`SequelizeMeta`) and demo seeders (`SequelizeData`). */
import { Umzug, SequelizeStorage } from "umzug";
import type { QueryInterface, Sequelize } from "sequelize";

interface Steps<C> {
  up: (params: { context: C }) => Promise<unknown>;
  down?: (params: { context: C }) => Promise<unknown>;
}

/**
 * Loads each file with this module's own `import()`, so that the TypeScript loader in use (tsx in
 * scripts, Vite's module runner in tests) handles `.ts`; umzug's default import would bypass it.
 */
function resolveWith<C>(context: C) {
  return ({ name, path }: { name: string; path?: string }) => {
    const load = () => import(/* @vite-ignore */ path!) as Promise<Steps<C>>;
    return {
      name,
      up: async () => (await load()).up({ context }),
      down: async () => {
        const m = await load();
        if (!m.down) throw new Error(`${name} cannot be rolled back: it has no down()`);
        return m.down({ context });
      },
    };
  };
}

export function createMigrator(sequelize: Sequelize, root = process.cwd()) {
  const context = sequelize.getQueryInterface();
  return new Umzug<QueryInterface>({
    migrations: { glob: ["migrations/*.ts", { cwd: root }], resolve: resolveWith(context) },
    context,
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}

export function createSeeder(sequelize: Sequelize, root = process.cwd()) {
  return new Umzug<Sequelize>({
    migrations: { glob: ["seeders/[0-9]*.ts", { cwd: root }], resolve: resolveWith(sequelize) },
    context: sequelize,
    storage: new SequelizeStorage({ sequelize, modelName: "SequelizeData" }),
    logger: undefined,
  });
}
