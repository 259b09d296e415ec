import { Module } from '@nestjs/common';
import { ConfigModule, ConfigService } from '@nestjs/config';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { ScheduleModule } from '@nestjs/schedule';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AdminModule } from './admin/admin.module';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { CommentsModule } from './comments/comments.module';
import { ConstraintRegionsModule } from './constraint-regions/constraint-regions.module';
import { LikelihoodsModule } from './likelihoods/likelihoods.module';
import { ApiExceptionFilter } from './common/filters/api-exception.filter';
import { AccessGuard } from './common/guards/access.guard';
import { buildConfig } from './config/build.config';
import { appConfig } from './config/app.config';
import { databaseConfig, type DatabaseConfig } from './config/database.config';
import { exportsConfig } from './config/exports.config';
import { invitationConfig } from './config/invitation.config';
import { mailConfig } from './config/mail.config';
import { maintenanceConfig } from './config/maintenance.config';
import { notificationsConfig } from './config/notifications.config';
import { redisConfig } from './config/redis.config';
import { DatabasePoolModule } from './database/database-pool.module';
import { buildDataSourceOptions } from './database/typeorm-options';
import { GroupsModule } from './groups/groups.module';
import { HealthModule } from './health/health.module';
import { InvitationsModule } from './invitations/invitations.module';
import { MailModule } from './mail/mail.module';
import { MaintenanceModule } from './maintenance/maintenance.module';
import { ModelsModule } from './models/models.module';
import { NotificationsModule } from './notifications/notifications.module';
import { RedisModule } from './redis/redis.module';
import { CitationsModule } from './citations/citations.module';
import { ReproductionsModule } from './reproductions/reproductions.module';
import { ScansModule } from './scans/scans.module';
import { TokensModule } from './tokens/tokens.module';
import { UsersModule } from './users/users.module';
import { WorkersModule } from './workers/workers.module';

@Module({
  imports: [
    // Configuration comes from the environment (the start script loads .env); nothing is read from files here.
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, load: [appConfig, databaseConfig, redisConfig, mailConfig, invitationConfig, notificationsConfig, maintenanceConfig, exportsConfig, buildConfig] }),
    TypeOrmModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => buildDataSourceOptions(config.getOrThrow<DatabaseConfig>('database')),
    }),
    DatabasePoolModule,
    // Timed jobs (nightly retention, mail digests, finished-scan notices) run inside the API.
    ScheduleModule.forRoot(),
    RedisModule,
    AuditModule,
    MailModule,
    UsersModule,
    AuthModule,
    GroupsModule,
    InvitationsModule,
    ModelsModule,
    ConstraintRegionsModule,
    LikelihoodsModule,
    ScansModule,
    ReproductionsModule,
    CitationsModule,
    TokensModule,
    NotificationsModule,
    CommentsModule,
    AdminModule,
    MaintenanceModule,
    HealthModule,
    WorkersModule,
  ],
  providers: [
    { provide: APP_GUARD, useClass: AccessGuard },
    { provide: APP_FILTER, useClass: ApiExceptionFilter },
  ],
})
export class AppModule {}
