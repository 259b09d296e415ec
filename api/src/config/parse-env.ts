import type { z } from 'zod';

/** Parses environment variables with a zod schema and stops the boot with every problem listed. */
export function parseEnv<T extends z.ZodType>(schema: T, env: NodeJS.ProcessEnv, area: string): z.infer<T> {
  const result = schema.safeParse(env);
  if (!result.success) {
    const problems = result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`Invalid ${area} configuration: ${problems}`);
  }
  return result.data;
}
