import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { readDatabaseConfig } from '../../config/database.config';
import { readSeedConfig } from '../../config/seed.config';
import { buildDataSourceOptions } from '../typeorm-options';
import { seedDemoScenario } from './seed-demo';

/** `npm run seed -w api`: puts the demo scenario into an empty database, never into production. */
async function main(): Promise<void> {
  if (readSeedConfig().refuseDemo) {
    throw new Error('NODE_ENV is production: the demo accounts have a published password, so they are never seeded there');
  }
  const ds = new DataSource(buildDataSourceOptions(readDatabaseConfig()));
  await ds.initialize();
  try {
    const { seeded } = await seedDemoScenario(ds);
    process.stdout.write(seeded ? 'demo scenario seeded\n' : 'the database already has accounts: demo not seeded\n');
  } finally {
    await ds.destroy();
  }
}

main().catch((err: unknown) => {
  process.stderr.write(`seeding failed: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
