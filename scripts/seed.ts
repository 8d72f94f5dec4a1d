/** Seeds the demo scenario into the configured database, once: an existing user list is left alone. */
import { db } from '../db/index';
import { DEMO_SOURCES, seedDemo } from '../db/seeds/demo';
import { seedDemoTown } from '../db/seeds/demo-town';
import { countPlaces } from '../db/places';

async function main() {
  const [{ count }] = await db('users').count<{ count: string }[]>({ count: '*' });
  if (Number(count) > 0) {
    // A database seeded before the places layer existed gets the demo town once.
    if ((await countPlaces('demo')).buildings === 0 && (await db('users').where({ email: 'chair@example.test' }).first())) {
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
