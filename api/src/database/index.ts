// What the worker takes from the API's database layer: the entities, the TypeORM options and
// the configuration readers, so both processes see one schema.
export * from './entities';
export { buildDataSourceOptions } from './typeorm-options';
export { readDatabaseConfig, type DatabaseConfig } from '../config/database.config';
export { readRedisConfig, type RedisConfig } from '../config/redis.config';
export { completeIfAllStored } from '../scans/scan-completion';
