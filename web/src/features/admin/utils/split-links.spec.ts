import { splitLinks } from './split-links';

describe('splitLinks', () => {
  it('finds http(s) links and leaves trailing punctuation in the text', () => {
    expect(splitLinks('Open http://127.0.0.1:3060/invitations/12.345.abc_-Z. Then wait (see https://x.example/a?b=1).')).toEqual([
      { kind: 'text', text: 'Open ' },
      { kind: 'link', href: 'http://127.0.0.1:3060/invitations/12.345.abc_-Z' },
      { kind: 'text', text: '. Then wait (see ' },
      { kind: 'link', href: 'https://x.example/a?b=1' },
      { kind: 'text', text: ').' },
    ]);
  });

  it('leaves other schemes and plain text alone', () => {
    expect(splitLinks('javascript:alert(1) and ftp://x.example')).toEqual([{ kind: 'text', text: 'javascript:alert(1) and ftp://x.example' }]);
    expect(splitLinks('')).toEqual([]);
  });
});
