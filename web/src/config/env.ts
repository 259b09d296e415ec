import { z } from 'zod';

// Only VITE_* variables reach the browser; parse them once so a typo fails loudly at start.
const envSchema = z.object({
  VITE_API_BASE_PATH: z
    .string()
    .regex(/^\/[^?#]*[^/?#]$|^\/$/, 'VITE_API_BASE_PATH is a path such as /api')
    .default('/api'),
});

export const env = envSchema.parse(import.meta.env);
