import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { UsersModule } from '../users/users.module';
import { ApiToken } from './entities/api-token.entity';
import { TokensController } from './tokens.controller';
import { TokensService } from './tokens.service';

@Module({
  imports: [TypeOrmModule.forFeature([ApiToken]), UsersModule, AuditModule],
  controllers: [TokensController],
  providers: [TokensService],
  // The global AccessGuard authenticates bearer requests with it.
  exports: [TokensService],
})
export class TokensModule {}
