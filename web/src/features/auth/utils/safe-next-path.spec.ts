import { safeNextPath } from './safe-next-path';

describe('safeNextPath', () => {
  it('keeps in-app paths with their query', () => {
    expect(safeNextPath('/scans?page=2', '/scans')).toBe('/scans?page=2');
  });

  it.each([null, '', 'https://elsewhere.example/', '//elsewhere.example', '/\\elsewhere.example', '/sign-in?next=/x'])(
    'falls back for %s',
    (next) => {
      expect(safeNextPath(next, '/scans')).toBe('/scans');
    },
  );
});
