import { Module, type OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { PassportModule } from '@nestjs/passport';
import { ThrottlerModule } from '@nestjs/throttler';
import { ThrottlerStorageRedisService } from '@nest-lab/throttler-storage-redis';
import { AuditModule } from '../audit/audit.module';
import type { AppConfig } from '../config/app.config';
import { REDIS_CLIENT, type RedisClient } from '../redis/redis.module';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { loginThrottlers } from './guards/login-throttler.guard';
import { LocalStrategy } from './local.strategy';
import { limitPasswordChecks } from './passwords';
import { SessionSerializer } from './session.serializer';

@Module({
  imports: [
    UsersModule,
    AuditModule,
    PassportModule.register({ session: true }),
    ThrottlerModule.forRootAsync({
      inject: [ConfigService, REDIS_CLIENT],
      useFactory: (config: ConfigService, redis: RedisClient) => ({
        throttlers: loginThrottlers(config.getOrThrow<AppConfig>('app').loginThrottle),
        // The API's own connection: given a client, the storage neither opens nor closes it.
        storage: new ThrottlerStorageRedisService(redis),
      }),
    }),
  ],
  controllers: [AuthController],
  providers: [AuthService, LocalStrategy, SessionSerializer],
})
export class AuthModule implements OnModuleInit {
  constructor(private readonly config: ConfigService) {}

  onModuleInit(): void {
    const { concurrency, queue } = this.config.getOrThrow<AppConfig>('app').passwordChecks;
    limitPasswordChecks(concurrency, queue);
  }
}
