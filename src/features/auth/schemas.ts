import { z } from 'zod';

// The sign-in and account forms' rules. They mirror the server's
// (server/auth/auth.schemas.ts) until both move into src/shared.

const email = z.string().trim().toLowerCase().min(1, 'Enter your e-mail address.').pipe(z.email('Enter a valid e-mail address.'));
const newPassword = z.string().min(10, 'Use at least 10 characters.').max(200, 'Use at most 200 characters.');

export const signInSchema = z.object({
  email: z.string().trim().min(1, 'Enter your e-mail address.'),
  password: z.string().min(1, 'Enter your password.'),
});

export const signUpSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name.').max(120, 'Use at most 120 characters.'),
  email,
  password: newPassword,
  businessName: z.string().trim().min(1, 'Enter the business name.').max(120, 'Use at most 120 characters.'),
  siteName: z.string().trim().min(1, 'Name your first café.').max(120, 'Use at most 120 characters.'),
  country: z.string().trim().toUpperCase().regex(/^[A-Z]{2}$/, 'Choose the country the business trades in.'),
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, 'Choose the currency your prices are in.')
    .refine((c) => {
      try {
        new Intl.NumberFormat('en', { style: 'currency', currency: c });
        return true;
      } catch {
        return false;
      }
    }, 'Unknown currency code.'),
  taxMode: z.enum(['inclusive', 'exclusive'], 'Choose whether menu prices include tax.'),
});

export const forgotPasswordSchema = z.object({ email: z.string().trim().min(1, 'Enter your e-mail address.') });

export const resetPasswordSchema = z
  .object({ password: newPassword, confirm: z.string().min(1, 'Type the new password again.') })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

export const acceptInvitationSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name.').max(120, 'Use at most 120 characters.'),
  password: newPassword,
});

export type SignInInput = z.output<typeof signInSchema>;
export type SignUpInput = z.output<typeof signUpSchema>;
