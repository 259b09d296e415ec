import { InjectQueue } from '@nestjs/bull';
import { ConflictException, Injectable } from '@nestjs/common';
import type { Queue } from 'bull';
import { chunkJobId, chunkPriority, COMPUTE_CHUNK_JOB, SCAN_QUEUE, scanChunks, type ComputeChunkJob, type ScanMethod } from '@sixtyfold/shared';

/** Puts a scan's chunks on the queue; job ids come from scan and chunk, so a repeat adds nothing. */
@Injectable()
export class ScanQueueService {
  constructor(@InjectQueue(SCAN_QUEUE) private readonly queue: Queue<ComputeChunkJob>) {}

  async enqueue(scanId: number, total: number, method: ScanMethod, only?: ReadonlySet<number>): Promise<number> {
    const chunks = scanChunks(scanId, total, method).filter((c) => !only || only.has(c.chunk));
    // A chunk queued again (a retry) must not meet its earlier job: bull adds nothing under an id it still holds.
    if (only) for (const c of chunks) await this.clearFinishedJob(chunkJobId(scanId, c.chunk));
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

  /**
   * Removes a chunk's finished job. Its points are stored before bull hears the job is done, so
   * right after a scan finishes the last job can still be active for a moment: wait that out.
   */
  private async clearFinishedJob(jobId: string): Promise<void> {
    for (let attempt = 0; attempt < 50; attempt++) {
      const job = await this.queue.getJob(jobId);
      if (!job) return;
      const state = await job.getState();
      if (state === 'waiting' || state === 'delayed' || state === 'paused') return;
      if (state === 'completed' || state === 'failed') {
        // Removed by bull itself meanwhile (removeOnComplete) is as good; look again.
        const removed = await job.remove().then(() => true, () => false);
        if (removed) return;
      }
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    throw new ConflictException('A worker is still finishing this scan; try again in a moment');
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
    // A job that finishes while bull lists the active ones comes back as null.
    const active = (await this.queue.getActive()).filter((j): j is NonNullable<typeof j> => j !== null);
    return active.filter((j) => j.data.scanId === scanId).reduce((n, j) => n + (j.data.end - j.data.start), 0);
  }
}
