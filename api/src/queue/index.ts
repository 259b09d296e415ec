// What the worker takes from the API for Redis: the one config reader, the one client factory and
// module, and the scan queue's registration, so both processes connect and queue the same way.
export { readRedisConfig, redisConfig, type RedisConfig } from '../config/redis.config';
export { createRedisClient, type RedisClient } from '../redis/redis-client';
export { REDIS_CLIENT, RedisModule } from '../redis/redis.module';
export { ScanQueueModule, type ScanQueueOptions } from './scan-queue.module';
