import { describe, expect, it } from 'vitest';
import { acceptInvitationSchema, createShopSchema, inviteSchema, MIN_PASSWORD_LENGTH, signInSchema } from '~/lib/schemas/account.ts';

function firstIssue(result: { success: boolean; error?: { issues: { path: (string | number)[]; message: string }[] } }) {
  const issue = result.error?.issues[0];
  return issue ? { path: issue.path.join('.'), message: issue.message } : null;
}

describe('account form schemas', () => {
  it('lower-cases and trims e-mail addresses so lookups are case-insensitive', () => {
    const parsed = signInSchema.parse({ email: '  Owner@Wrenfield.EXAMPLE ', password: 'x' });
    expect(parsed.email).toBe('owner@wrenfield.example');
  });

  it('names the field for a malformed, empty or over-long e-mail', () => {
    expect(firstIssue(createShopSchema.safeParse({ shopName: 'A', email: 'not-an-address' }))?.path).toBe('email');
    expect(firstIssue(createShopSchema.safeParse({ shopName: 'A', email: '' }))).toEqual({ path: 'email', message: 'Enter an e-mail address' });
    expect(firstIssue(createShopSchema.safeParse({ shopName: 'A', email: `${'a'.repeat(250)}@b.example` }))?.path).toBe('email');
  });

  it(`refuses passwords shorter than ${MIN_PASSWORD_LENGTH} characters and mismatched repeats`, () => {
    const short = acceptInvitationSchema.safeParse({ displayName: 'Ada', password: 'a'.repeat(MIN_PASSWORD_LENGTH - 1), confirmPassword: 'a'.repeat(MIN_PASSWORD_LENGTH - 1) });
    expect(firstIssue(short)?.path).toBe('password');
    const ok = acceptInvitationSchema.safeParse({ displayName: 'Ada', password: 'a'.repeat(MIN_PASSWORD_LENGTH), confirmPassword: 'a'.repeat(MIN_PASSWORD_LENGTH) });
    expect(ok.success).toBe(true);
    const differ = acceptInvitationSchema.safeParse({ displayName: 'Ada', password: 'a'.repeat(12), confirmPassword: 'b'.repeat(12) });
    expect(firstIssue(differ)).toEqual({ path: 'confirmPassword', message: 'The two passwords differ' });
  });

  it('refuses empty and over-long names, and unknown roles', () => {
    expect(firstIssue(createShopSchema.safeParse({ shopName: '   ', email: 'a@b.example' }))?.path).toBe('shopName');
    expect(firstIssue(createShopSchema.safeParse({ shopName: 'x'.repeat(121), email: 'a@b.example' }))?.path).toBe('shopName');
    expect(firstIssue(inviteSchema.safeParse({ email: 'a@b.example', role: 'admin' }))?.path).toBe('role');
  });
});
