// `npm run migrate`: applies pending migrations to DATABASE_URL.
import { runMigrations } from '../server/migrate.ts';
import { sequelize } from '../server/db.ts';

const applied = await runMigrations();
console.log(applied.length ? `Applied ${applied.map((m) => m.name).join(', ')}` : 'The database is up to date.');
await sequelize.close();
