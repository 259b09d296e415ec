import type { DataSourceOptions } from 'typeorm';
import type { DatabaseConfig } from '../config/database.config';
import { ENTITIES } from './entities';
import { MIGRATIONS } from './migrations';

/** TypeORM options for MariaDB; the schema only ever changes through migrations. */
export function buildDataSourceOptions(config: DatabaseConfig): DataSourceOptions {
  return {
    type: 'mariadb',
    host: config.host,
    port: config.port,
    username: config.username,
    password: config.password,
    database: config.database,
    poolSize: config.poolSize,
    // mysql2 verifies the server's certificate (rejectUnauthorized) whenever TLS is on.
    ...(config.tls ? { ssl: { ...config.tls, rejectUnauthorized: true } } : {}),
    // mysql2's pool refuses waiters beyond this; the wait itself is bounded by limitPoolWait().
    extra: { queueLimit: config.queueLimit },
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    entities: ENTITIES,
    migrations: MIGRATIONS,
    migrationsTableName: 'schema_migrations',
    synchronize: false,
    // TypeORM 1 refuses undefined/null in where clauses; filters must leave such keys out.
    invalidWhereValuesBehavior: { undefined: 'throw', null: 'throw' },
  } as DataSourceOptions;
}
