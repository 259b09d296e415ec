import { Module } from '@nestjs/common';
import { ExportsService } from './exports.service';

/** Streamed downloads: their limits, their one pipeline each, and their end on shutdown. */
@Module({ providers: [ExportsService], exports: [ExportsService] })
export class ExportsModule {}
