import { describe, expect, it } from 'vitest';
import { readModelFile, toModelFile } from './model-file.schema.js';

const plateauFile = {
  format: 'sixtyfold.potential',
  version: 1,
  name: 'Plateau',
  expression: 'V0 * (1 - exp(-sqrt(2 / 3) * phi))^2',
  parameters: [{ name: 'V0', defaultValue: 1e-10, min: 1e-12, max: 1e-8, description: 'height' }],
  phiInit: 5.5,
  description: 'a plateau',
};
const pretty = (value: unknown) => JSON.stringify(value, null, 2);

describe('readModelFile', () => {
  it('reads a valid file into the model input of the chosen group', () => {
    const read = readModelFile(pretty(plateauFile), 4);
    expect(read).toEqual({
      ok: true,
      model: { groupId: 4, name: 'Plateau', expression: plateauFile.expression, parameters: plateauFile.parameters, phiInit: 5.5, description: 'a plateau' },
    });
  });

  it('round-trips what toModelFile exports', () => {
    const exported = toModelFile({ ...plateauFile, parameters: [{ name: 'V0', defaultValue: 1e-10, description: '' }] });
    const read = readModelFile(pretty(exported), 1);
    expect(read.ok && read.model.parameters).toEqual([{ name: 'V0', defaultValue: 1e-10, description: '' }]);
  });

  it('names the line of a JSON syntax error', () => {
    const text = '{\n  "format": "sixtyfold.potential",\n  "version": 1\n  "name": "x"\n}';
    const read = readModelFile(text, 1);
    expect(read).toMatchObject({ ok: false, line: 4 });
    expect(!read.ok && read.message).toMatch(/^line 4: the file is not valid JSON: comma expected here/);
  });

  it('names the line of a value that breaks the schema', () => {
    const text = pretty({ ...plateauFile, parameters: [{ ...plateauFile.parameters[0], defaultValue: 'big' }] });
    const read = readModelFile(text, 1);
    const line = text.split('\n').findIndex((l) => l.includes('"big"')) + 1;
    expect(read).toMatchObject({ ok: false, line });
    expect(!read.ok && read.message).toMatch(new RegExp(`^line ${line}: parameters\\.0\\.defaultValue: `));
  });

  it('refuses another format and an expression that does not read, with their lines', () => {
    const wrongFormat = readModelFile(pretty({ ...plateauFile, format: 'other' }), 1);
    expect(wrongFormat).toMatchObject({ ok: false, line: 2, message: 'line 2: format: format must be "sixtyfold.potential"' });
    const text = pretty({ ...plateauFile, expression: 'V0 * sinn(phi)' });
    const badExpression = readModelFile(text, 1);
    expect(badExpression).toMatchObject({ ok: false, line: 5 });
    expect(!badExpression.ok && badExpression.message).toMatch(/^line 5: expression: at character 6/);
  });

  it('points a missing field at its object, and refuses what is not an object', () => {
    const { phiInit: _, ...noPhi } = plateauFile;
    expect(readModelFile(pretty(noPhi), 1)).toMatchObject({ ok: false, line: 1 });
    expect(readModelFile('[1, 2]', 1)).toMatchObject({ ok: false, line: 1, message: 'line 1: the file must hold one JSON object' });
    expect(readModelFile('', 1)).toMatchObject({ ok: false, line: 1 });
  });
});
