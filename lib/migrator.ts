import path from "node:path";
import type { QueryInterface, Sequelize } from "sequelize";
import { SequelizeStorage, Umzug } from "umzug";

/**
 * Migrations are TypeScript modules in migrations/, applied in name order by umzug and
 * recorded in the `schema_migrations` table. Run outside Next (scripts/migrate.ts, tests).
 */
export function migrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: {
      glob: ["migrations/*.ts", { cwd: path.resolve(__dirname, "..") }],
      resolve: ({ name, path: file, context }) => ({
        name,
        up: async () => (await import(file!)).up({ context, name }),
        down: async () => (await import(file!)).down({ context, name }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: "schema_migrations" }),
    logger: undefined,
  });
}
