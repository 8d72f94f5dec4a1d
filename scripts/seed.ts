/** Seeds the demo scenario into the configured database, once: an existing user list is left alone. */
import { db } from '../db/index';
import { alreadySeeded, seedDemo } from '../db/seeds/demo';

async function main() {
  if (await alreadySeeded(db)) {
    console.log('quietfix: demo data already present; not seeding again.');
    return;
  }
  await db.transaction(seedDemo);
  console.log('quietfix: demo scenario seeded.');
}

main()
  .catch((err) => {
    console.error('quietfix: seeding failed:', err.message);
    process.exitCode = 1;
  })
  .finally(() => db.destroy());
