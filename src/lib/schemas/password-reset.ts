import { z } from 'zod';
import { emailSchema, passwordSchema } from './auth';

/** A reset token is 32 random bytes in base64url: 43 characters. */
export const RESET_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

export const INVALID_RESET_LINK = 'This reset link is not valid. Ask for a new one.';

export const passwordResetRequestSchema = z.object({ email: emailSchema });

export const passwordResetConfirmSchema = z.object({
  token: z.string({ required_error: 'The reset token is missing' }).regex(RESET_TOKEN_PATTERN, INVALID_RESET_LINK),
  // The same rule as sign-up, so a reset can never set a password sign-up would refuse.
  password: passwordSchema,
});

/** The HTML form asks for the new password twice; the API takes it once. */
export const resetPasswordFormSchema = passwordResetConfirmSchema
  .extend({ repeat: z.string({ required_error: 'Type the new password again' }) })
  .refine((form) => form.password === form.repeat, { path: ['repeat'], message: 'The two passwords are not the same' });
