import { describe, expect, it } from 'vitest';
import { changePasswordSchema, loginSchema } from './auth.schema.js';
import { groupRoleAtLeast } from './roles.schema.js';

describe('loginSchema', () => {
  it('normalises the e-mail address', () => {
    expect(loginSchema.parse({ email: '  Lucia.Marin@Halvorsen.EXAMPLE ', password: 'x' }).email).toBe('lucia.marin@halvorsen.example');
  });

  it('names each missing or malformed field', () => {
    const result = loginSchema.safeParse({ email: 'no-at-sign' });
    expect(result.success).toBe(false);
    const byField = Object.fromEntries(result.error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(byField).toEqual({
      email: 'Enter an e-mail address like name@institute.example',
      password: 'Enter your password',
    });
  });

  it('refuses an empty password and an absurdly long one', () => {
    expect(loginSchema.safeParse({ email: 'a@b.example', password: '' }).success).toBe(false);
    expect(loginSchema.safeParse({ email: 'a@b.example', password: 'x'.repeat(201) }).success).toBe(false);
  });
});

describe('groupRoleAtLeast', () => {
  it('orders lead above member above viewer', () => {
    expect(groupRoleAtLeast('lead', 'member')).toBe(true);
    expect(groupRoleAtLeast('member', 'member')).toBe(true);
    expect(groupRoleAtLeast('viewer', 'member')).toBe(false);
    expect(groupRoleAtLeast('member', 'lead')).toBe(false);
  });
});

describe('changePasswordSchema', () => {
  const byField = (body: unknown) => {
    const result = changePasswordSchema.safeParse(body);
    return result.success ? {} : Object.fromEntries(result.error.issues.map((i) => [i.path.join('.'), i.message]));
  };

  it('accepts a current password and a new one of at least 10 characters', () => {
    expect(changePasswordSchema.parse({ currentPassword: 'old', newPassword: 'a new passphrase' })).toEqual({ currentPassword: 'old', newPassword: 'a new passphrase' });
  });

  it('names each missing or short field', () => {
    expect(byField({ newPassword: 'short' })).toEqual({
      currentPassword: 'Enter your current password',
      newPassword: 'Choose a password of at least 10 characters',
    });
  });

  it('refuses a new password equal to the current one', () => {
    expect(byField({ currentPassword: 'inflaton-demo-1', newPassword: 'inflaton-demo-1' })).toEqual({
      newPassword: 'Choose a password different from the current one',
    });
  });
});
