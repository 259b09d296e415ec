// What the worker takes from the API for Redis: the config factory, the connection module and the
// scan queue's registration, so both processes connect and queue the same way.
export { redisConfig } from '../config/redis.config';
export { REDIS_CLIENT, RedisModule, type RedisClient } from '../redis/redis.module';
export { ScanQueueModule, type ScanQueueOptions } from './scan-queue.module';
