import { z } from 'zod';
import { acceptInviteSchema, loginSchema, password, resetRequestSchema, signupSchema } from '../../shared/contract/auth';

// The account forms validate with the very schemas the server does (src/shared/contract/auth.ts).

export const signInSchema = loginSchema;
export const signUpSchema = signupSchema;
export const forgotPasswordSchema = resetRequestSchema;
export const acceptInvitationSchema = acceptInviteSchema;

export const resetPasswordSchema = z
  .object({ password, confirm: z.string().min(1, 'Type the new password again.') })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

export type SignInInput = z.output<typeof signInSchema>;
export type SignUpInput = z.output<typeof signUpSchema>;
