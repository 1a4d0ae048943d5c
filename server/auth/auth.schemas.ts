import { z } from 'zod';
import { ROLES } from './roles';

const email = z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.'));
// ISO 4217 codes as the runtime's Intl knows them.
const CURRENCIES = new Set(Intl.supportedValuesOf('currency'));

export const password = z.string().min(10, 'Use at least 10 characters.').max(200, 'Use at most 200 characters.');

export const loginSchema = z.object({ email: z.string().trim().min(1, 'Enter your e-mail address.'), password: z.string().min(1, 'Enter your password.') });

export const signupSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name.').max(120),
  email,
  password,
  businessName: z.string().trim().min(1, 'Enter the business name.').max(120),
  siteName: z.string().trim().min(1, 'Name your first café.').max(120),
  country: z.string().trim().toUpperCase().regex(/^[A-Z]{2}$/, 'Use a two-letter country code, e.g. GB or US.').default('GB'),
  currency: z.string().trim().toUpperCase().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code, e.g. GBP.').refine((c) => CURRENCIES.has(c), 'Unknown currency code.'),
  taxMode: z.enum(['inclusive', 'exclusive'], 'Choose whether menu prices include tax.'),
});

export const resetRequestSchema = z.object({ email: z.string().trim().min(1, 'Enter your e-mail address.') });
export const resetCompleteSchema = z.object({ token: z.string().min(10, 'The link is incomplete.'), password });
export const acceptInviteSchema = z.object({ name: z.string().trim().min(1, 'Enter your name.').max(120), password });
export const inviteSchema = z.object({ email, role: z.enum(ROLES, 'Choose a role.') });
export const roleChangeSchema = z.object({ role: z.enum(ROLES, 'Choose a role.') });
