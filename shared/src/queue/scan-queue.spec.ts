import { describe, expect, it } from 'vitest';
import { chunkJobId, chunkPoints, chunkSize, parseChunkJobId, scanChunks } from './scan-queue.js';

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

  it('share a small scan over the pool and keep a large one at about a second per chunk', () => {
    expect(scanChunks(1, 10_000, 'slowroll')).toHaveLength(16); // 625 points each
    expect(chunkSize(1_000_000, 'slowroll')).toBe(2000);
    expect(chunkSize(1_000_000, 'exact')).toBe(200);
    // Never below an eighth of the full size: tiny chunks would cost more in bookkeeping than they spread.
    expect(chunkSize(100, 'slowroll')).toBe(250);
    expect(chunkSize(100, 'exact')).toBe(25);
  });

  it('name jobs by scan and chunk, so a repeat enqueue adds nothing', () => {
    expect(chunkJobId(12, 3)).toBe('scan-12-chunk-3');
  });

  it('read scan and chunk back from a job id, and size a chunk without listing them all', () => {
    expect(parseChunkJobId(chunkJobId(12, 3))).toEqual({ scanId: 12, chunk: 3 });
    expect(parseChunkJobId('preview-5')).toBeNull();
    expect(parseChunkJobId('scan-1-chunk-2x')).toBeNull();
    for (const total of [1, 17, 10_000, 32_001]) {
      for (const c of scanChunks(7, total, 'exact')) expect(chunkPoints(total, 'exact', c.chunk)).toBe(c.end - c.start);
    }
    expect(chunkPoints(100, 'slowroll', 5)).toBe(0);
  });
});
