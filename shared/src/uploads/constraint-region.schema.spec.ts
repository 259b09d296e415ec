import { describe, expect, it } from 'vitest';
import { constraintRegionUploadSchema, regionCsvReader } from './constraint-region.schema.js';

/** Feeds CSV text line by line, as the API's parser does after splitting cells. */
function read(text: string) {
  const reader = regionCsvReader();
  text.split('\n').forEach((row, i) => (i === 0 ? reader.header(row.split(','), 1) : reader.row(row.split(','), i + 1)));
  return reader.finish();
}

describe('regionCsvReader', () => {
  it('reads the vertices in order', () => {
    expect(read('n_s,r\n0.95,0\n0.97,0\n0.965,0.05')).toEqual([{ ns: 0.95, r: 0 }, { ns: 0.97, r: 0 }, { ns: 0.965, r: 0.05 }]);
    expect(read('r,n_s\n0,0.95\n0,0.97\n0.05,0.965')[2]).toEqual({ ns: 0.965, r: 0.05 });
  });

  it('refuses wrong columns with what is expected', () => {
    expect(() => read('ns,r\n0.95,0')).toThrow('line 1: unknown column ns; missing column n_s; the header must name n_s, r');
    expect(() => read('n_s,r,r\n0.95,0,0')).toThrow('line 1: column r appears twice');
  });

  it('names the line and the reason of a bad row', () => {
    expect(() => read('n_s,r\n0.95,0\n0.97,abc\n0.96,0.1')).toThrow("line 3: column r is not a finite number ('abc')");
    expect(() => read('n_s,r\n0.95,0\n2.5,0\n0.96,0.1')).toThrow('line 3: n_s must lie between 0 and 2 (found 2.5)');
    expect(() => read('n_s,r\n0.95,-0.1\n0.97,0\n0.96,0.1')).toThrow('line 2: r cannot be negative (found -0.1)');
    expect(() => read('n_s,r\n0.95\n0.97,0\n0.96,0.1')).toThrow('line 2: expected 2 values (n_s, r), found 1');
    expect(() => read('n_s,r\n0.95,Infinity\n0.97,0\n0.96,0.1')).toThrow("line 2: column r is not a finite number ('Infinity')");
  });

  it('needs three vertices', () => {
    expect(() => read('n_s,r\n0.95,0\n0.97,0')).toThrow('a region needs at least 3 vertices, the file has 2');
  });
});

describe('constraintRegionUploadSchema', () => {
  it('coerces the multipart text fields and keeps the level strictly inside (0, 1)', () => {
    expect(constraintRegionUploadSchema.parse({ groupId: '3', name: ' A ', source: 'paper', confidenceLevel: '0.95' })).toEqual({
      groupId: 3, name: 'A', source: 'paper', confidenceLevel: 0.95,
    });
    for (const level of ['1', '0', '95']) {
      expect(constraintRegionUploadSchema.safeParse({ groupId: '3', name: 'A', source: 'p', confidenceLevel: level }).success).toBe(false);
    }
  });
});
