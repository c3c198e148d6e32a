import { describe, expect, it } from 'vitest';
import { signUpWithCodeSchema } from '../../src/lib/schemas/auth';
import { invitationsSchema } from '../../src/lib/schemas/invitations';
import { passwordResetConfirmSchema, passwordResetRequestSchema, resetPasswordFormSchema } from '../../src/lib/schemas/password-reset';

const token = 'Ab-_'.repeat(10) + 'xyz';

describe('sign-up with a join code', () => {
  it('normalises a code as the join form does and treats an empty field as none', () => {
    const base = { name: 'Rosa', email: 'rosa@example.org', password: '0123456789' };
    expect(signUpWithCodeSchema.parse({ ...base, joinCode: 'wren 4sma' }).joinCode).toBe('WREN4SMA');
    expect(signUpWithCodeSchema.parse({ ...base, joinCode: '  ' }).joinCode).toBeUndefined();
    expect(signUpWithCodeSchema.parse(base).joinCode).toBeUndefined();
    expect(signUpWithCodeSchema.safeParse({ ...base, joinCode: 'WREN0' }).success).toBe(false);
  });
});

describe('password reset schemas', () => {
  it('a request needs a valid e-mail, lower-cased', () => {
    expect(passwordResetRequestSchema.parse({ email: ' Ava@Example.org ' })).toEqual({ email: 'ava@example.org' });
    expect(passwordResetRequestSchema.safeParse({ email: 'nope' }).success).toBe(false);
    expect(passwordResetRequestSchema.safeParse({}).success).toBe(false);
  });

  it('a confirmation needs a 43-character base64url token and a sign-up-grade password', () => {
    expect(passwordResetConfirmSchema.safeParse({ token, password: '0123456789' }).success).toBe(true);
    expect(passwordResetConfirmSchema.safeParse({ token: token.slice(1), password: '0123456789' }).success).toBe(false);
    expect(passwordResetConfirmSchema.safeParse({ token: token.replace('A', '+'), password: '0123456789' }).success).toBe(false);
    expect(passwordResetConfirmSchema.safeParse({ token, password: '012345678' }).success).toBe(false);
  });

  it('the form wants the password twice and names the second field when they differ', () => {
    const differ = resetPasswordFormSchema.safeParse({ token, password: '0123456789', repeat: '0123456780' });
    expect(differ.success).toBe(false);
    if (!differ.success) expect(differ.error.flatten().fieldErrors.repeat).toEqual(['The two passwords are not the same']);
    expect(resetPasswordFormSchema.safeParse({ token, password: '0123456789', repeat: '0123456789' }).success).toBe(true);
  });
});

describe('invitations body', () => {
  it('takes 1 to 500 entries with an e-mail and an optional name', () => {
    expect(invitationsSchema.safeParse({ invites: [{ email: 'a@example.org' }, { email: 'b@example.org', name: null }] }).success).toBe(true);
    expect(invitationsSchema.safeParse({ invites: [] }).success).toBe(false);
    expect(invitationsSchema.safeParse({ invites: [{ name: 'x' }] }).success).toBe(false);
    expect(invitationsSchema.safeParse({ invites: Array.from({ length: 501 }, () => ({ email: 'a@example.org' })) }).success).toBe(false);
  });
});
