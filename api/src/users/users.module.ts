import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { Membership } from '../groups/entities/membership.entity';
import { User } from './entities/user.entity';
import { UsersService } from './users.service';

@Module({
  imports: [TypeOrmModule.forFeature([User, Membership]), AuditModule],
  providers: [UsersService],
  exports: [UsersService],
})
export class UsersModule {}
