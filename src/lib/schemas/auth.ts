import { z } from 'zod';
import { ROLES } from '../roles';
import { joinClassSchema } from './classes';

// Shared by the JSON endpoints and the HTML forms so both refuse the same input the same way.

/** The one e-mail rule: sign-up, sign-in, invitations and roster rows all check addresses the same way. */
export const emailSchema = z
  .string({ required_error: 'E-mail is required' })
  .trim()
  .toLowerCase()
  .min(3, 'E-mail is required')
  .max(254, 'E-mail is too long')
  .email('Enter a valid e-mail address');

export const passwordSchema = z
  .string({ required_error: 'Password is required' })
  .min(10, 'Password needs at least 10 characters')
  .max(200, 'Password is at most 200 characters');

export const personNameSchema = z
  .string({ required_error: 'Name is required' })
  .trim()
  .min(1, 'Name is required')
  .max(80, 'Name is at most 80 characters');

export const signUpSchema = z.object({
  name: personNameSchema,
  email: emailSchema,
  password: passwordSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

/** Sign-up from a class invitation also carries the class's join code; an empty field means none. */
export const signUpWithCodeSchema = signUpSchema.extend({
  joinCode: z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? undefined : v), joinClassSchema.shape.joinCode.optional()),
});

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ required_error: 'Password is required' }).min(1, 'Password is required').max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const roleChangeSchema = z.object({
  role: z.enum(ROLES, { errorMap: () => ({ message: `Role must be one of ${ROLES.join(', ')}` }) }),
});
