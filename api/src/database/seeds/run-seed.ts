import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { readDatabaseConfig } from '../../config/database.config';
import { buildDataSourceOptions } from '../typeorm-options';
import { seedDemoScenario } from './seed-demo';

/** `npm run seed -w api`: adds the demo scenario where it is missing. */
async function main(): Promise<void> {
  const ds = new DataSource(buildDataSourceOptions(readDatabaseConfig()));
  await ds.initialize();
  try {
    const { created } = await seedDemoScenario(ds);
    process.stdout.write(`demo scenario: ${created === 0 ? 'already present' : `${created} records added`}\n`);
  } finally {
    await ds.destroy();
  }
}

main().catch((err: unknown) => {
  process.stderr.write(`seeding failed: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
