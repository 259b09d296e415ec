import { InjectQueue } from '@nestjs/bull';
import { ConflictException, Injectable } from '@nestjs/common';
import type { Queue } from 'bull';
import {
  chunkJobId, chunkJobOptions, COMPUTE_CHUNK_JOB, jobPoints, parseChunkJobId, SCAN_QUEUE, scanChunks, type ComputeChunkJob, type ScanMethod,
} from '@sixtyfold/shared';

/** A chunk job still to run or running, read from its id. */
export interface LiveChunkJob {
  id: string;
  scanId: number;
  chunk: number;
  /** First point of a continuation; null for a chunk's first job. */
  from: number | null;
  active: boolean;
}

/** Puts a scan's chunks on the queue; job ids come from scan and chunk, so a repeat adds nothing. */
@Injectable()
export class ScanQueueService {
  constructor(@InjectQueue(SCAN_QUEUE) private readonly queue: Queue<ComputeChunkJob>) {}

  async enqueue(scanId: number, total: number, method: ScanMethod, only?: ReadonlySet<number>): Promise<number> {
    const chunks = scanChunks(scanId, total, method).filter((c) => !only || only.has(c.chunk));
    // A chunk queued again (a retry) must not meet its earlier job: bull adds nothing under an id it still holds.
    if (only) for (const c of chunks) await this.clearFinishedJob(chunkJobId(scanId, c.chunk));
    await this.queue.addBulk(chunks.map((data) => ({ name: COMPUTE_CHUNK_JOB, data, opts: chunkJobOptions(data) })));
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

  /**
   * Every chunk job waiting, delayed or running, read in one MULTI so the picture is of one
   * moment: a worker hands a continuation on before its own job leaves the active list, so a
   * chunk being worked on is always in it, as its job or its continuation.
   */
  async liveJobs(): Promise<LiveChunkJob[]> {
    const key = (name: string) => this.queue.toKey(name);
    const replies = (await this.queue.client
      .multi()
      .lrange(key('active'), 0, -1)
      .lrange(key('wait'), 0, -1)
      .lrange(key('paused'), 0, -1)
      .zrange(key('delayed'), 0, -1)
      .exec()) ?? [];
    const jobs: LiveChunkJob[] = [];
    replies.forEach(([error, ids], list) => {
      if (error) throw error;
      for (const id of ids as string[]) {
        const parsed = parseChunkJobId(id);
        if (parsed) jobs.push({ id, ...parsed, active: list === 0 });
      }
    });
    return jobs;
  }

  /** Takes a scan's waiting chunks and continuations off the queue; chunks already running stop on their own. */
  async remove(scanId: number): Promise<number> {
    let removed = 0;
    for (const live of await this.liveJobs()) {
      if (live.scanId !== scanId || live.active) continue;
      const job = await this.queue.getJob(live.id);
      // A worker may take the job between the look and the removal; it then stops on its own.
      if (job && !(await job.isActive()) && (await job.remove().then(() => true, () => false))) removed++;
    }
    return removed;
  }

  /**
   * Points of this scan in jobs that a worker holds right now: a whole chunk, or the rest of one
   * for a continuation (its first part is stored already). One read of the active list's job ids
   * (scan, chunk and first point are in the id), no job fetched: a job that finishes meanwhile cannot fail it.
   */
  async runningPoints(scanId: number, total: number, method: ScanMethod): Promise<number> {
    const ids = await this.queue.client.lrange(this.queue.toKey('active'), 0, -1);
    let points = 0;
    for (const id of ids) {
      const job = parseChunkJobId(id);
      if (job?.scanId === scanId) points += jobPoints(total, method, job);
    }
    return points;
  }
}
