import { Module } from '@nestjs/common';
import { ConfigModule } from '@nestjs/config';
import { TypeOrmModule } from '@nestjs/typeorm';
import { buildConfig, buildDataSourceOptions, readDatabaseConfig } from '@sixtyfold/api/database';
import { RedisModule, redisConfig } from '@sixtyfold/api/queue';
import { workerConfig } from './config/worker.config';
import { ScansModule } from './scans/scans.module';

/** The worker process: no HTTP server, one database connection pool, one place in the pool. */
@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, load: [workerConfig, redisConfig, buildConfig] }),
    RedisModule,
    TypeOrmModule.forRootAsync({ useFactory: () => buildDataSourceOptions(readDatabaseConfig()) }),
    ScansModule,
  ],
})
export class WorkerModule {}
