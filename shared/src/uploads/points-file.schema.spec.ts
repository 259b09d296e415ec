import { describe, expect, it } from 'vitest';
import { POINT_LIST_MAX_POINTS } from '../schemas/scan.schema.js';
import { pointsCsvReader } from './points-file.schema.js';

/** Feeds CSV text line by line, as the API's parser does after splitting cells. */
function read(text: string, options?: Parameters<typeof pointsCsvReader>[0]) {
  const reader = pointsCsvReader(options);
  text.split('\n').forEach((row, i) => (i === 0 ? reader.header(row.split(','), 1) : reader.row(row.split(','), i + 1)));
  return reader.finish();
}

describe('pointsCsvReader', () => {
  it('reads the header as the columns and each row as one point', () => {
    expect(read('f,nStar\n5,50\n7.5,1e1')).toEqual({ pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7.5, 10]] }, headerLine: 1 });
  });

  it('names the line and the reason of a bad row', () => {
    expect(() => read('f,nStar\n5,50\n7,abc')).toThrow("line 3: column nStar is not a finite number ('abc')");
    expect(() => read('f,nStar\n5,50\n7')).toThrow('line 3: expected 2 values (f, nStar), found 1');
    expect(() => read('f,nStar\n5,')).toThrow('line 2: column nStar is empty');
    expect(() => read('f\nInfinity')).toThrow("line 2: column f is not a finite number ('Infinity')");
  });

  it('refuses a header with repeated, empty or (given the model) unknown columns', () => {
    expect(() => read('f,f\n1,2')).toThrow('line 1: column f appears twice');
    expect(() => read('f,,nStar\n1,2,3')).toThrow('line 1: column 2 of the header has no name');
    expect(() => read('f,lambda\n1,2', { parameters: ['f', 'Lambda'] })).toThrow(
      'line 1: unknown column lambda; the columns can be f, Lambda, nStar, reheatingW, reheatingEnergyGeV',
    );
    expect(read('Lambda,nStar\n1,2', { parameters: ['f', 'Lambda'] }).pointList.columns).toEqual(['Lambda', 'nStar']);
  });

  it('refuses an empty file, a file without points, and too many rows', () => {
    const reader = pointsCsvReader();
    expect(() => reader.finish()).toThrow('the file is empty; it needs a header naming the columns, then one point per line');
    expect(() => read('f,nStar')).toThrow('line 1: the file has a header but no points');
    expect(() => read('f\n1\n2\n3', { maxRows: 2 })).toThrow('line 4: a points file has at most 2 points');
    // By default the limit of a stored point list: 50,000 rows read, the next one refused on its own line.
    const rows = Array.from({ length: POINT_LIST_MAX_POINTS }, (_, i) => String(i + 1)).join('\n');
    expect(read(`f\n${rows}`).pointList.rows).toHaveLength(POINT_LIST_MAX_POINTS);
    expect(() => read(`f\n${rows}\n7`)).toThrow(`line ${POINT_LIST_MAX_POINTS + 2}: a points file has at most 50,000 points`);
  });
});
