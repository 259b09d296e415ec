import { Module } from '@nestjs/common';
import { ConfigModule, ConfigService } from '@nestjs/config';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AdminModule } from './admin/admin.module';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { ConstraintRegionsModule } from './constraint-regions/constraint-regions.module';
import { ApiExceptionFilter } from './common/filters/api-exception.filter';
import { AccessGuard } from './common/guards/access.guard';
import { appConfig } from './config/app.config';
import { databaseConfig, type DatabaseConfig } from './config/database.config';
import { redisConfig } from './config/redis.config';
import { buildDataSourceOptions } from './database/typeorm-options';
import { GroupsModule } from './groups/groups.module';
import { HealthModule } from './health/health.module';
import { ModelsModule } from './models/models.module';
import { RedisModule } from './redis/redis.module';
import { ScansModule } from './scans/scans.module';
import { TokensModule } from './tokens/tokens.module';
import { UsersModule } from './users/users.module';
import { WorkersModule } from './workers/workers.module';

@Module({
  imports: [
    // Configuration comes from the environment (the start script loads .env); nothing is read from files here.
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, load: [appConfig, databaseConfig, redisConfig] }),
    TypeOrmModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => buildDataSourceOptions(config.getOrThrow<DatabaseConfig>('database')),
    }),
    RedisModule,
    AuditModule,
    UsersModule,
    AuthModule,
    GroupsModule,
    ModelsModule,
    ConstraintRegionsModule,
    ScansModule,
    TokensModule,
    AdminModule,
    HealthModule,
    WorkersModule,
  ],
  providers: [
    { provide: APP_GUARD, useClass: AccessGuard },
    { provide: APP_FILTER, useClass: ApiExceptionFilter },
  ],
})
export class AppModule {}
