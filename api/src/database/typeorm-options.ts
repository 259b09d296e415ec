import type { DataSourceOptions } from 'typeorm';
import type { DatabaseConfig } from '../config/database.config';
import { ENTITIES } from './entities';
import { MIGRATIONS } from './migrations';

/** The field a mysql2 `typeCast` sees (the part used here). */
interface CastField {
  type: string;
  string(): string | null;
}

/**
 * DOUBLE columns read to the exact double MariaDB holds. mysql2's text-protocol parser builds a
 * number of up to 17 characters digit by digit (×10, then one division), which is off by an ulp
 * once the digits pass 2^53: "9.081184755800415" read back as 9.081184755800416. `Number()` rounds
 * correctly, so a stored output equals the engine's number bit for bit (reproducibility checks
 * compare them so, and exports promise the exact round trip).
 */
export function exactDoubles(field: CastField, next: () => unknown): unknown {
  if (field.type !== 'DOUBLE') return next();
  const text = field.string();
  return text === null ? null : Number(text);
}

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
    extra: { queueLimit: config.queueLimit, typeCast: exactDoubles },
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
