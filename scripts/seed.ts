/** Seeds the demo scenario into the configured database, once: an existing user list is left alone. */
import { db } from '../db/index';
import { alreadySeeded, DEMO_SOURCES, seedDemo } from '../db/seeds/demo';
import { seedDemoTown } from '../db/seeds/demo-town';
import { countPlaces } from '../db/places';
import { getUserByEmail } from '../db/users';

async function main() {
  if (await alreadySeeded(db)) {
    // A database seeded before the places layer existed gets the demo town once.
    if ((await countPlaces('demo')).buildings === 0 && (await getUserByEmail('chair@example.test'))) {
      await db.transaction((trx) => seedDemoTown(trx, DEMO_SOURCES.open, DEMO_SOURCES.located));
      console.log('quietfix: demo town added.');
    }
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
