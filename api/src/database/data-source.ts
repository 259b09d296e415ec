import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { readDatabaseConfig } from '../config/database.config';
import { buildDataSourceOptions } from './typeorm-options';

/** For the TypeORM CLI only: `npx typeorm migration:generate -d dist/database/data-source.js`. */
export const dataSource = new DataSource(buildDataSourceOptions(readDatabaseConfig()));
