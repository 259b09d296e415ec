import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { readDatabaseConfig } from '../config/database.config';
import { buildDataSourceOptions } from './typeorm-options';

/** Runs pending migrations: `npm run migrate -w api` (after a build). */
async function main(): Promise<void> {
  const ds = new DataSource(buildDataSourceOptions(readDatabaseConfig()));
  await ds.initialize();
  try {
    const applied = await ds.runMigrations({ transaction: 'each' });
    process.stdout.write(`migrations: ${applied.length} applied${applied.map((m) => `\n  ${m.name}`).join('')}\n`);
  } finally {
    await ds.destroy();
  }
}

main().catch((err: unknown) => {
  process.stderr.write(`migration failed: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
