import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { WorkerModule } from './worker.module';

async function bootstrap(): Promise<void> {
  const app = await NestFactory.createApplicationContext(WorkerModule);
  // SIGTERM and SIGINT run the shutdown hooks: heartbeats stop and the pool forgets this process.
  app.enableShutdownHooks();
  Logger.log(`worker ${process.pid} ready`, 'Bootstrap');
}

bootstrap().catch((err: unknown) => {
  process.stderr.write(`worker failed to start: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
