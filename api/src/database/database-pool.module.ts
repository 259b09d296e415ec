import { Global, Module } from '@nestjs/common';
import { DatabasePoolService } from './database-pool.service';

/** The pool's limits and figures, for every module (health, exports). */
@Global()
@Module({ providers: [DatabasePoolService], exports: [DatabasePoolService] })
export class DatabasePoolModule {}
