import { describe, expect, it } from 'vitest';
import { roleChangeSchema, signInSchema, signUpSchema } from '../../src/lib/schemas/auth';
import { createClassSchema, joinClassSchema } from '../../src/lib/schemas/classes';
import { homePathFor } from '../../src/lib/roles';
import { safeNext } from '../../src/lib/server/forms';

describe('sign-up schema', () => {
  it('trims the name and lower-cases the e-mail', () => {
    const parsed = signUpSchema.parse({ name: '  Ava  ', email: ' Ava@Larkspur.Example ', password: '0123456789' });
    expect(parsed).toEqual({ name: 'Ava', email: 'ava@larkspur.example', password: '0123456789' });
  });

  it('names every bad field', () => {
    const result = signUpSchema.safeParse({ name: '', email: 'nope', password: 'short' });
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(Object.keys(result.error.flatten().fieldErrors).sort()).toEqual(['email', 'name', 'password']);
  });

  it('refuses missing fields and wrong types', () => {
    expect(signUpSchema.safeParse({}).success).toBe(false);
    expect(signUpSchema.safeParse({ name: 1, email: [], password: null }).success).toBe(false);
  });
});

describe('sign-in schema', () => {
  it('needs an e-mail and a password', () => {
    expect(signInSchema.safeParse({ email: 'a@b.example', password: '' }).success).toBe(false);
    expect(signInSchema.safeParse({ email: 'a@b.example', password: 'x' }).success).toBe(true);
  });
});

describe('class schemas', () => {
  it('normalises a join code typed from the board', () => {
    expect(joinClassSchema.parse({ joinCode: 'wren 4sma' }).joinCode).toBe('WREN4SMA');
    expect(joinClassSchema.parse({ joinCode: 'WREN-4SMA' }).joinCode).toBe('WREN4SMA');
  });

  it('refuses codes with look-alike characters or the wrong length', () => {
    expect(joinClassSchema.safeParse({ joinCode: 'WREN0SMA' }).success).toBe(false); // 0 is not in the alphabet
    expect(joinClassSchema.safeParse({ joinCode: 'WREN4SM' }).success).toBe(false);
  });

  it('needs a class name of at least 2 characters', () => {
    expect(createClassSchema.safeParse({ name: ' A ' }).success).toBe(false);
    expect(createClassSchema.parse({ name: ' Small Engines II ' }).name).toBe('Small Engines II');
  });
});

describe('roles', () => {
  it('accepts only known roles', () => {
    expect(roleChangeSchema.safeParse({ role: 'instructor' }).success).toBe(true);
    expect(roleChangeSchema.safeParse({ role: 'owner' }).success).toBe(false);
  });

  it('sends each role to its own home page', () => {
    expect([homePathFor('learner'), homePathFor('instructor'), homePathFor('admin')]).toEqual(['/learn', '/teach', '/admin/users']);
  });
});

describe('post-sign-in destination', () => {
  it('allows same-site paths only', () => {
    expect(safeNext('/teach')).toBe('/teach');
    expect(safeNext('//evil.example/')).toBeNull();
    expect(safeNext('/\\evil.example')).toBeNull();
    expect(safeNext('https://evil.example/')).toBeNull();
    expect(safeNext(null)).toBeNull();
  });
});
