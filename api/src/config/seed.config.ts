import { z } from 'zod';
import { parseEnv } from './parse-env';

const schema = z.object({
  NODE_ENV: z.string().default('development'),
});

export interface SeedConfig {
  /** The demo scenario publishes its password, so a production database never gets it. */
  refuseDemo: boolean;
}

/** Read by `npm run seed -w api`, which runs outside the Nest application. */
export function readSeedConfig(env: NodeJS.ProcessEnv = process.env): SeedConfig {
  const e = parseEnv(schema, env, 'seed');
  return { refuseDemo: e.NODE_ENV === 'production' };
}
