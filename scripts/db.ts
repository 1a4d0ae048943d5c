// Database chores run by the start, dev and reset scripts under tsx:
//   tsx scripts/db.ts migrate            run pending migrations
//   tsx scripts/db.ts seed-once          migrate, then seed if the demo has never been loaded
//   tsx scripts/db.ts reset              migrate, then seed (every seed resets its own tables)
import { createDb, migrateLatest, runSeeds } from '../server/platform/db';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set');
  process.exit(1);
}
const cmd = process.argv[2];
const db = createDb(url);
try {
  await migrateLatest(db);
  if (cmd === 'reset' || (cmd === 'seed-once' && !(await db('businesses').first()))) {
    await runSeeds(db);
    console.log('Demo data loaded.');
  }
} finally {
  await db.destroy();
}
