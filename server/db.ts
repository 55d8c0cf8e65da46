import { Sequelize } from 'sequelize';
import pg from 'pg';
import { config } from './config.ts';
import { replicationFrom } from './db-replication.ts';

// Return bigint counts as numbers and numeric columns (thresholds, areas) as JS numbers.
pg.types.setTypeParser(20, (v) => Number(v));
pg.types.setTypeParser(1700, (v) => Number(v));

const replication = replicationFrom(config.databaseUrl, config.databaseReplicaUrls);

export const sequelize = new Sequelize(config.databaseUrl, {
  dialect: 'postgres',
  logging: false,
  define: { underscored: true, timestamps: true },
  pool: { max: 10, idle: 10_000 },
  ...(replication ? { replication } : {}),
});

/** Whether the database answers at all (the readiness probe). */
export async function pingDatabase() {
  await sequelize.query('SELECT 1');
}
