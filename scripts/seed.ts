// `npm run seed`: adds the demo scenario to DATABASE_URL (once).
import { seedDemo } from './seed/seed-demo.ts';
import { sequelize } from '../server/db.ts';

const { created } = await seedDemo();
console.log(created ? 'Demo scenario seeded.' : 'Demo scenario already present; nothing changed.');
await sequelize.close();
