import pg from "pg";
import { Sequelize } from "sequelize";
import { databaseUrl } from "@/lib/env";
import { initModels } from "@/models";

type Db = { sequelize: Sequelize; models: ReturnType<typeof initModels> };

const globalForDb = globalThis as unknown as { loxodromeDb?: Db };

function connect(): Db {
  const sequelize = new Sequelize(databaseUrl, {
    dialect: "postgres",
    dialectModule: pg,
    logging: process.env.LOXODROME_SQL_LOG === "1" ? console.log : false,
    pool: { max: Number(process.env.DB_POOL_MAX ?? 10), idle: 10_000 },
    define: { underscored: true },
  });
  return { sequelize, models: initModels(sequelize) };
}

/** One Sequelize instance per process, kept on globalThis so dev hot reloads reuse it. */
export function db(): Db {
  if (!globalForDb.loxodromeDb) globalForDb.loxodromeDb = connect();
  return globalForDb.loxodromeDb;
}

export async function closeDb(): Promise<void> {
  const current = globalForDb.loxodromeDb;
  globalForDb.loxodromeDb = undefined;
  if (current) await current.sequelize.close();
}
