// What the worker takes from the API's database layer: the entities, the TypeORM options and
// the configuration reader, so both processes see one schema and connect the same way (Redis and
// the scan queue: `@sixtyfold/api/queue`).
export * from './entities';
export { buildDataSourceOptions } from './typeorm-options';
export { readDatabaseConfig, type DatabaseConfig } from '../config/database.config';
export { completeIfAllStored } from '../scans/scan-completion';
