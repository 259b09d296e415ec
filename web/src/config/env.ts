import { z } from 'zod';

// Only VITE_* variables reach the browser; parse them once so a typo fails loudly at start.
const envSchema = z.object({
  // Where the API lives on this origin; no trailing slash.
  VITE_API_BASE_PATH: z
    .string()
    .regex(/^\/[\w\-/]*[\w-]$/, 'VITE_API_BASE_PATH is a path such as /api, without a trailing slash')
    .default('/api'),
});

export const env = envSchema.parse(import.meta.env);
