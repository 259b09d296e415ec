import { registerAs } from '@nestjs/config';
import { z } from 'zod';

const schema = z.object({
  WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(1),
});

export interface WorkerConfig {
  concurrency: number;
}

export function readWorkerConfig(env: NodeJS.ProcessEnv = process.env): WorkerConfig {
  const result = schema.safeParse(env);
  if (!result.success) {
    throw new Error(`Invalid worker configuration: ${result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  }
  return { concurrency: result.data.WORKER_CONCURRENCY };
}

export const workerConfig = registerAs('worker', () => readWorkerConfig());
