// What the worker takes from the API's database layer: the entities, the TypeORM options, the
// scan lifecycle (the one owner of a scan's status and counters) and the configuration readers
// and the Redis connection helpers, so both processes see one schema and connect the same way.
export * from './entities';
export { buildDataSourceOptions } from './typeorm-options';
export { readDatabaseConfig, type DatabaseConfig } from '../config/database.config';
export { readRedisConfig, type RedisConfig } from '../config/redis.config';
export * from './scan-lifecycle';
export { connectRedis, bullRedisOptions, type RedisClient } from '../redis/redis-connection';
