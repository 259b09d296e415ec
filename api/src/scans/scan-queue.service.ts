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
    if (only) {
      // A finished job keeps its id in Redis for a while; clear it so the chunk can run again.
      for (const c of chunks) {
        const job = await this.queue.getJob(chunkJobId(scanId, c.chunk));
        if (job && ((await job.isFailed()) || (await job.isCompleted()))) await job.remove();
      }
    }
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

  /** Takes a scan's waiting chunks off the queue; chunks already running stop on their own. */
  async remove(scanId: number, total: number, method: ScanMethod): Promise<number> {
    let removed = 0;
    for (const c of scanChunks(scanId, total, method)) {
      const job = await this.queue.getJob(chunkJobId(scanId, c.chunk));
      if (job && !(await job.isActive())) {
        await job.remove();
        removed++;
      }
    }
    return removed;
  }

  /** Points of this scan in chunks that a worker holds right now. */
  async runningPoints(scanId: number): Promise<number> {
    const active = await this.queue.getActive();
    return active.filter((j) => j.data.scanId === scanId).reduce((n, j) => n + (j.data.end - j.data.start), 0);
  }
}
