import { describe, expect, it } from 'vitest';
import {
  chunkJobId, chunkJobOptions, chunkPoints, chunkPriority, chunkSize, computeChunkJobSchema, continuationOf, jobIdOf, jobPoints, parseChunkJobId, scanChunks,
  SLICE_PRIORITY_STEP,
} from './scan-queue.js';

describe('scan chunks', () => {
  it('cover every point once, in order, for any size', () => {
    for (const total of [1, 15, 16, 17, 999, 10_000, 32_001, 1_000_000]) {
      for (const method of ['slowroll', 'exact'] as const) {
        const chunks = scanChunks(7, total, method);
        expect(chunks[0].start).toBe(0);
        expect(chunks.at(-1)!.end).toBe(total);
        for (let i = 1; i < chunks.length; i++) expect(chunks[i].start).toBe(chunks[i - 1].end);
        expect(chunks.map((c) => c.chunk)).toEqual(chunks.map((_, i) => i));
      }
    }
  });

  it('share a small scan over the pool and keep a large one in chunks of a second or a few', () => {
    expect(scanChunks(1, 10_000, 'slowroll')).toHaveLength(16); // 625 points each
    expect(chunkSize(1_000_000, 'slowroll')).toBe(10_000);
    expect(chunkSize(100_000, 'slowroll')).toBe(6250);
    expect(chunkSize(1_000_000, 'exact')).toBe(200);
    // Never below 250 (25 exact): tiny chunks would cost more in bookkeeping than they spread.
    expect(chunkSize(100, 'slowroll')).toBe(250);
    expect(chunkSize(100, 'exact')).toBe(25);
  });

  it('name jobs by scan and chunk, so a repeat enqueue adds nothing', () => {
    expect(chunkJobId(12, 3)).toBe('scan-12-chunk-3');
  });

  it('read scan and chunk back from a job id, and size a chunk without listing them all', () => {
    expect(parseChunkJobId(chunkJobId(12, 3))).toEqual({ scanId: 12, chunk: 3, from: null });
    expect(parseChunkJobId('preview-5')).toBeNull();
    expect(parseChunkJobId('scan-1-chunk-2x')).toBeNull();
    for (const total of [1, 17, 10_000, 32_001]) {
      for (const c of scanChunks(7, total, 'exact')) expect(chunkPoints(total, 'exact', c.chunk)).toBe(c.end - c.start);
    }
    expect(chunkPoints(100, 'slowroll', 5)).toBe(0);
  });

  it('name a continuation by the point it starts from, so handing it on twice adds one job', () => {
    const [first] = scanChunks(12, 1000, 'exact'); // chunk 0: points 0–62
    expect(jobIdOf(first)).toBe('scan-12-chunk-0');
    const rest = continuationOf(first, 40);
    expect(rest).toEqual({ scanId: 12, chunk: 0, start: 40, end: first.end, slices: 1 });
    expect(jobIdOf(rest)).toBe('scan-12-chunk-0-from-40');
    expect(jobIdOf(rest)).toBe(jobIdOf(continuationOf(first, 40)));
    expect(parseChunkJobId(jobIdOf(rest))).toEqual({ scanId: 12, chunk: 0, from: 40 });
    expect(parseChunkJobId('scan-12-chunk-0-from-')).toBeNull();
    // A continuation of a continuation counts the slices, and starts further on.
    const third = continuationOf(rest, 55);
    expect(third).toMatchObject({ start: 55, end: first.end, slices: 2 });
    expect(jobIdOf(third)).toBe(chunkJobId(12, 0, 55));
    expect(computeChunkJobSchema.parse(third)).toEqual(third);
    expect(() => computeChunkJobSchema.parse({ ...first, slices: 0 })).toThrow();
  });

  it('count the points a running job still has: a continuation only the rest of its chunk', () => {
    const size = chunkSize(1000, 'exact');
    expect(jobPoints(1000, 'exact', { chunk: 2, from: null })).toBe(size);
    expect(jobPoints(1000, 'exact', { chunk: 2, from: 2 * size + 10 })).toBe(size - 10);
    // The last chunk is short; its continuation counts to the scan's end.
    const last = scanChunks(1, 1000, 'exact').at(-1)!;
    expect(jobPoints(1000, 'exact', { chunk: last.chunk, from: last.end - 3 })).toBe(3);
  });

  it('send a continuation behind other scans\' waiting chunks, further for each slice it has had', () => {
    const [first] = scanChunks(5, 1000, 'exact');
    expect(chunkJobOptions(first)).toMatchObject({ jobId: 'scan-5-chunk-0', priority: chunkPriority(0), attempts: 5 });
    const rest = continuationOf(first, 10);
    expect(chunkJobOptions(rest).priority).toBe(chunkPriority(0) + SLICE_PRIORITY_STEP);
    // Behind the first 16 chunks of a scan submitted meanwhile (a small scan is cut into 16).
    expect(chunkJobOptions(rest).priority).toBeGreaterThan(chunkPriority(15));
    expect(chunkJobOptions(continuationOf(rest, 20)).priority).toBe(chunkPriority(0) + 2 * SLICE_PRIORITY_STEP);
  });
});
