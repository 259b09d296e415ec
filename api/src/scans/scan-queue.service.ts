import { InjectQueue } from '@nestjs/bull';
import { Injectable } from '@nestjs/common';
import type { Queue } from 'bull';
import { chunkJobId, chunkPriority, COMPUTE_CHUNK_JOB, SCAN_QUEUE, scanChunks, type ComputeChunkJob, type ScanMethod } from '@sixtyfold/shared';

/** Puts a scan's chunks on the queue; job ids come from scan and chunk, so a repeat adds nothing. */
@Injectable()
export class ScanQueueService {
  constructor(@InjectQueue(SCAN_QUEUE) private readonly queue: Queue<ComputeChunkJob>) {}

  async enqueue(scanId: number, total: number, method: ScanMethod, only?: ReadonlySet<number>): Promise<number> {
    const chunks = scanChunks(scanId, total, method).filter((c) => !only || only.has(c.chunk));
    await this.queue.addBulk(
      chunks.map((data) => ({
        name: COMPUTE_CHUNK_JOB,
        data,
        opts: {
          jobId: chunkJobId(scanId, data.chunk),
          priority: chunkPriority(data.chunk),
          attempts: 5,
          backoff: { type: 'exponential', delay: 2000 },
          removeOnComplete: true,
          removeOnFail: 1000,
        },
      })),
    );
    return chunks.length;
  }
}
