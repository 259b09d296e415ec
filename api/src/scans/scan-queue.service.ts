import { InjectQueue } from '@nestjs/bull';
import { ConflictException, Injectable } from '@nestjs/common';
import type { Queue } from 'bull';
import {
  chunkJobId, chunkPoints, chunkPriority, COMPUTE_CHUNK_JOB, parseChunkJobId, SCAN_QUEUE, scanChunks, type ComputeChunkJob, type ScanMethod,
} from '@sixtyfold/shared';

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
      // A worker may take the job between the look and the removal; it then stops on its own.
      if (job && !(await job.isActive()) && (await job.remove().then(() => true, () => false))) removed++;
    }
    return removed;
  }

  /**
   * Points of this scan in chunks that a worker holds right now. One read of the active list's job
   * ids (scan and chunk are in the id), no job fetched: a job that finishes meanwhile cannot fail it.
   */
  async runningPoints(scanId: number, total: number, method: ScanMethod): Promise<number> {
    const ids = await this.queue.client.lrange(this.queue.toKey('active'), 0, -1);
    let points = 0;
    for (const id of ids) {
      const job = parseChunkJobId(id);
      if (job?.scanId === scanId) points += chunkPoints(total, method, job.chunk);
    }
    return points;
  }
}
