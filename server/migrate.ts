// Migrations run through umzug; each file in server/migrations exports up/down taking a QueryInterface-free
// raw-SQL runner, so the schema (with its PostGIS types and constraints) is written as the database sees it.
import { Umzug, SequelizeStorage } from 'umzug';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Sequelize } from 'sequelize';
import { sequelize as defaultSequelize } from './db.ts';

export interface MigrationContext {
  query: (sql: string) => Promise<unknown>;
}
export type MigrationFn = (params: { context: MigrationContext }) => Promise<void>;

const migrationsDir = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

export function migrator(sequelize: Sequelize = defaultSequelize) {
  return new Umzug<MigrationContext>({
    migrations: { glob: ['*.ts', { cwd: migrationsDir }] },
    context: { query: (sql) => sequelize.query(sql) },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export async function runMigrations(sequelize: Sequelize = defaultSequelize) {
  return migrator(sequelize).up();
}
