import { describe, expect, it } from 'vitest';
import { readPointsFile } from './read-points-file';

describe('readPointsFile', () => {
  it('reads the file as the API does: notes and blank lines skipped, lines counted as in the file', () => {
    expect(readPointsFile('# picked by hand\nf,nStar\n5, 50\n\n7.5,55\n', ['Lambda', 'f'])).toEqual({
      ok: true,
      pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7.5, 55]] },
      headerLine: 2,
    });
  });

  it('names the line of a bad row, an unknown column and a broken quote', () => {
    expect(readPointsFile('f,nStar\n5,50\n\n7,fifty\n', ['f'])).toEqual({ ok: false, message: "line 4: column nStar is not a finite number ('fifty')", line: 4 });
    expect(readPointsFile('f,lambda\n5,1\n', ['Lambda', 'f'])).toMatchObject({ ok: false, line: 1, message: expect.stringMatching(/^line 1: unknown column lambda;/) });
    expect(readPointsFile('f,nStar\n5,"50\n', ['f'])).toMatchObject({ ok: false, message: expect.stringMatching(/the file is not valid CSV/) });
    expect(readPointsFile('', ['f'])).toMatchObject({ ok: false, message: expect.stringMatching(/^the file is empty/) });
  });
});
