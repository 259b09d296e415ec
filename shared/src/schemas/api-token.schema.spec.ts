import { describe, expect, it } from 'vitest';
import { API_TOKEN_PATTERN, createApiTokenSchema } from './api-token.schema.js';

describe('createApiTokenSchema', () => {
  it('trims the name and gives a token 90 days, with full access, when nothing else is asked', () => {
    expect(createApiTokenSchema.parse({ name: '  laptop notebook ' })).toEqual({ name: 'laptop notebook', expiresInDays: 90, readOnly: false });
  });

  it('keeps a read-only choice and refuses anything but a boolean', () => {
    expect(createApiTokenSchema.parse({ name: 'x', readOnly: true }).readOnly).toBe(true);
    const result = createApiTokenSchema.safeParse({ name: 'x', readOnly: 'yes' });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0].path).toEqual(['readOnly']);
  });

  it('names each bad field', () => {
    const result = createApiTokenSchema.safeParse({ name: '   ', expiresInDays: 1.5 });
    expect(result.success).toBe(false);
    const byField = Object.fromEntries(result.error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(byField).toEqual({ name: 'give the token a name', expiresInDays: 'expiresInDays must be a whole number of days' });
  });

  it('keeps the lifetime between 1 and 365 days', () => {
    expect(createApiTokenSchema.safeParse({ name: 'x', expiresInDays: 0 }).success).toBe(false);
    expect(createApiTokenSchema.safeParse({ name: 'x', expiresInDays: 366 }).success).toBe(false);
    expect(createApiTokenSchema.parse({ name: 'x', expiresInDays: 365 }).expiresInDays).toBe(365);
  });
});

describe('API_TOKEN_PATTERN', () => {
  it('accepts sfy_ and 43 base64url characters only', () => {
    expect(API_TOKEN_PATTERN.test(`sfy_${'A1b-_'.repeat(8)}xyz`)).toBe(true);
    expect(API_TOKEN_PATTERN.test(`sfy_${'a'.repeat(42)}`)).toBe(false);
    expect(API_TOKEN_PATTERN.test(`xyz_${'a'.repeat(43)}`)).toBe(false);
    expect(API_TOKEN_PATTERN.test(`sfy_${'a'.repeat(42)}=`)).toBe(false);
  });
});
