import { registerAs } from '@nestjs/config';
import { z } from 'zod';
import { parseEnv } from './parse-env';

const schema = z.object({
  REDIS_URL: z
    .string()
    .regex(/^rediss?:\/\//, 'REDIS_URL must look like redis://host:port/db')
    .default('redis://127.0.0.1:6390/0'),
});

export interface RedisConfig {
  url: string;
  host: string;
  port: number;
  db: number;
  password?: string;
}

export function readRedisConfig(env: NodeJS.ProcessEnv = process.env): RedisConfig {
  const { REDIS_URL } = parseEnv(schema, env, 'redis');
  const url = new URL(REDIS_URL);
  return {
    url: REDIS_URL,
    host: url.hostname,
    port: Number(url.port || 6379),
    db: Number(url.pathname.replace(/^\//, '') || 0),
    password: url.password ? decodeURIComponent(url.password) : undefined,
  };
}

export const redisConfig = registerAs('redis', () => readRedisConfig());
