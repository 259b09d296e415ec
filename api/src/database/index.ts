// What the worker takes from the API's database layer: the entities, the TypeORM options, the
// configuration reader and the scan lifecycle (the one owner of a scan's status and counters),
// so both processes see one schema and one set of rules for a scan's life (Redis and the scan
// queue: `@sixtyfold/api/queue`).
export * from './entities';
export { buildDataSourceOptions } from './typeorm-options';
export { readDatabaseConfig, type DatabaseConfig } from '../config/database.config';
export * from './scan-lifecycle';
// What the worker records with each chunk it computes: its engine version, commit and Node (the same factory as the API's).
export { buildConfig, readBuildConfig } from '../config/build.config';
