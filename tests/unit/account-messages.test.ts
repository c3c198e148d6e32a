import { describe, expect, it } from 'vitest';
import { addedToClassMail, classInvitationMail, pageLink, passwordResetMail, resetLink, signUpLink } from '../../src/lib/mail/account-messages';

describe('links in mail', () => {
  it('a sign-up link carries the join code and the address, encoded', () => {
    const link = signUpLink('https://bench.larkspur.example', 'WREN4SMA', 'ava+shop@example.org');
    expect(link).toBe('https://bench.larkspur.example/sign-up?code=WREN4SMA&email=ava%2Bshop%40example.org');
    const url = new URL(link);
    expect(url.searchParams.get('email')).toBe('ava+shop@example.org');
  });

  it('a reset link carries the token as it is (base64url needs no escaping)', () => {
    const token = 'Ab-_'.repeat(10) + 'xyz';
    expect(resetLink('http://localhost:4321', token)).toBe(`http://localhost:4321/reset-password?token=${token}`);
    expect(pageLink('http://localhost:4321', '/sign-in')).toBe('http://localhost:4321/sign-in');
  });
});

describe('account and class messages', () => {
  it('an invitation names the class and the instructor and carries the sign-up link and the code', () => {
    const mail = classInvitationMail({
      className: 'Small Engines I',
      instructorName: 'Dana Whitcombe',
      inviteeName: 'Ava',
      joinCode: 'WREN4SMA',
      signUpUrl: 'https://bench.example/sign-up?code=WREN4SMA&email=ava%40example.org',
      signInUrl: 'https://bench.example/sign-in',
    });
    expect(mail.subject).toBe('You are invited to Small Engines I on Benchwright');
    expect(mail.text).toMatch(/^Hello Ava,\n/);
    expect(mail.text).toContain('Dana Whitcombe invited you to the class Small Engines I');
    expect(mail.text).toContain('\nhttps://bench.example/sign-up?code=WREN4SMA&email=ava%40example.org\n');
    expect(mail.text).toContain('enter the join code WREN4SMA');
  });

  it('an invitation without a name greets plainly', () => {
    const mail = classInvitationMail({ className: 'C', instructorName: 'I', joinCode: 'X', signUpUrl: 'u', signInUrl: 's' });
    expect(mail.text.startsWith('Hello,\n')).toBe(true);
  });

  it('the added-to-class notice says there is nothing to do and links sign-in and the reset page', () => {
    const mail = addedToClassMail({
      className: 'Small Engines I',
      instructorName: 'Dana Whitcombe',
      learnerName: 'Ben Okafor',
      signInUrl: 'https://bench.example/sign-in',
      forgotPasswordUrl: 'https://bench.example/forgot-password',
    });
    expect(mail.subject).toBe('You were added to Small Engines I on Benchwright');
    expect(mail.text).toContain('Dana Whitcombe added you to the class Small Engines I');
    expect(mail.text).toContain('Sign in: https://bench.example/sign-in');
    expect(mail.text).toContain('Forgot your password? https://bench.example/forgot-password');
  });

  it('the reset mail carries the link on a line of its own and says how long it works', () => {
    const mail = passwordResetMail({ name: 'Ava', resetUrl: 'https://bench.example/reset-password?token=abc', expiresInMinutes: 60 });
    expect(mail.subject).toBe('Set a new Benchwright password');
    expect(mail.text.split('\n')).toContain('https://bench.example/reset-password?token=abc');
    expect(mail.text).toContain('works once, for 1 hour');
    expect(mail.text).toContain('If you did not ask for this');
    expect(passwordResetMail({ name: 'A', resetUrl: 'u', expiresInMinutes: 30 }).text).toContain('for 30 minutes');
    expect(passwordResetMail({ name: 'A', resetUrl: 'u', expiresInMinutes: 120 }).text).toContain('for 2 hours');
  });
});
