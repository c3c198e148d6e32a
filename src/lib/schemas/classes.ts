import { z } from 'zod';

/** Join codes avoid look-alike characters (0/O, 1/I/L) so they survive being read aloud. */
export const JOIN_CODE_ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';
export const JOIN_CODE_LENGTH = 8;

export const createClassSchema = z.object({
  name: z
    .string({ required_error: 'Class name is required' })
    .trim()
    .min(2, 'Class name needs at least 2 characters')
    .max(80, 'Class name is at most 80 characters'),
});

export const joinClassSchema = z.object({
  joinCode: z
    .string({ required_error: 'Join code is required' })
    .trim()
    .toUpperCase()
    // People type spaces and dashes when copying a code from the board.
    .transform((s) => s.replace(/[\s-]/g, ''))
    .pipe(
      z
        .string()
        .length(JOIN_CODE_LENGTH, `A join code has ${JOIN_CODE_LENGTH} characters`)
        .regex(new RegExp(`^[${JOIN_CODE_ALPHABET}]+$`), 'A join code uses letters and digits only'),
    ),
});
