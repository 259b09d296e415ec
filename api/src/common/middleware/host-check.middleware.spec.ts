import { describe, expect, it } from '@jest/globals';
import { allowedHostMatcher } from './host-check.middleware';

describe('allowedHostMatcher', () => {
  const production = allowedHostMatcher({ appUrl: 'https://sixtyfold.halvorsen.example/', extra: ['10.0.0.5:3060', '[2001:db8::5]'], loopback: false });
  const development = allowedHostMatcher({ appUrl: 'http://127.0.0.1:3060/', extra: [], loopback: true });

  it("takes APP_URL's host with or without its default port, in any case", () => {
    for (const host of ['sixtyfold.halvorsen.example', 'sixtyfold.halvorsen.example:443', 'SixtyFold.Halvorsen.Example']) {
      expect({ host, allowed: production(host) }).toEqual({ host, allowed: true });
    }
    expect(production('sixtyfold.halvorsen.example:8443')).toBe(false);
  });

  it('takes ALLOWED_HOSTS entries with exactly their port', () => {
    expect(production('10.0.0.5:3060')).toBe(true);
    expect(production('10.0.0.5')).toBe(false);
    expect(production('10.0.0.5:3061')).toBe(false);
    expect(production('[2001:db8::5]')).toBe(true);
    expect(production('[2001:DB8:0::5]')).toBe(true);
  });

  it('refuses other names, look-alikes and headers that are not a plain host', () => {
    for (const host of [
      undefined, '', 'evil.example', 'sixtyfold.halvorsen.example.evil.example', 'evil.example@sixtyfold.halvorsen.example',
      'sixtyfold.halvorsen.example/evil', 'sixtyfold.halvorsen.example:443:1', 'http://sixtyfold.halvorsen.example',
    ]) {
      expect({ host, allowed: production(host) }).toEqual({ host, allowed: false });
    }
  });

  it('takes the loopback names on any port only when asked to', () => {
    for (const host of ['127.0.0.1:5173', 'localhost', 'LOCALHOST:3060', '[::1]:3060', '[0:0:0:0:0:0:0:1]:3060']) {
      expect({ host, dev: development(host), prod: production(host) }).toEqual({ host, dev: true, prod: false });
    }
    expect(development('127.0.0.2:3060')).toBe(false);
    expect(development('evil.example:3060')).toBe(false);
  });
});
