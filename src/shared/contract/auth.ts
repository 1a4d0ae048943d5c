import { z } from 'zod';
import { ROLES } from '../capabilities';
import { email, text } from '../schemas/basic-fields';
import { endpoint } from './endpoint';

/** A password: 10–200 characters (NIST SP 800-63B asks at least 8; we ask 10). */
export const password = z
  .string({ error: 'Enter a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')
  // eslint-disable-next-line no-control-regex
  .refine((s) => !/[\u0000-\u001F\u007F]/.test(s), 'Remove the control characters.');

export const TAX_MODES = ['inclusive', 'exclusive'] as const;

export const userSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  businessId: z.uuid(),
});
export type User = z.output<typeof userSchema>;

export const businessSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  country: z.string(),
  currency: z.string(),
  taxMode: z.enum(TAX_MODES),
  /** The tax's own name there: VAT, GST, sales tax. */
  taxName: z.string(),
  /** IANA time zone: the business's "today", months and dates are its own. */
  timeZone: z.string(),
});
export type Business = z.output<typeof businessSchema>;

/** What login, sign-up, accepting an invitation and `me` answer. */
export const sessionSchema = z.object({ user: userSchema, csrfToken: z.string(), business: businessSchema });
export type Session = z.output<typeof sessionSchema>;

export const loginSchema = z.object({
  email: text({ min: 1, max: 254 }).pipe(z.string().min(1, 'Enter your e-mail address.')),
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200, 'Use at most 200 characters.'),
});

export const resetRequestSchema = z.object({ email: text({ min: 1, max: 254 }).pipe(z.string().min(1, 'Enter your e-mail address.')) });
export const resetCompleteSchema = z.object({ token: z.string({ error: 'The link is incomplete.' }).min(10, 'The link is incomplete.').max(200, 'The link is not one of ours.'), password });
export const changePasswordSchema = z.object({ currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(200), newPassword: password });
export const acceptInviteSchema = z.object({ name: text({ what: 'person', min: 1, max: 120 }).pipe(z.string().min(1, 'Enter your name.')), password });

const tokenParams = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{10,200}$/) });

export const login = endpoint({
  method: 'POST', path: '/api/auth/login', access: 'public',
  summary: 'Signs in with e-mail and password; answers the session and sets its cookie.',
  body: loginSchema, response: sessionSchema,
  errors: { 401: '`bad_credentials`', 429: '`throttled`: too many failed sign-ins for this account from this address, or from this address' },
});

export const me = endpoint({
  method: 'GET', path: '/api/auth/me', access: 'signed-in',
  summary: 'The signed-in session (user, CSRF token, business).',
  response: sessionSchema,
});

export const logout = endpoint({
  method: 'POST', path: '/api/auth/logout', access: 'public',
  summary: 'Ends the session.',
  response: null,
});

export const changePassword = endpoint({
  method: 'POST', path: '/api/auth/password', access: 'signed-in',
  summary: "Changes the signed-in user's password; every other session of theirs ends.",
  body: changePasswordSchema, response: null,
  errors: { 400: '`invalid_input` naming `currentPassword` when it is not the current password' },
});

export const requestPasswordReset = endpoint({
  method: 'POST', path: '/api/auth/password-reset/request', access: 'public',
  summary: 'E-mails a reset link when the address has an account; answers the same, at once, either way.',
  body: resetRequestSchema, response: z.object({ ok: z.literal(true) }), status: 202,
  errors: { 429: '`throttled`: too many requests from this address' },
});

export const completePasswordReset = endpoint({
  method: 'POST', path: '/api/auth/password-reset/complete', access: 'public',
  summary: "Sets a new password from a reset link; every session of that user ends.",
  body: resetCompleteSchema, response: null,
  errors: { 400: '`invalid_token`: expired or used' },
});

export const invitation = endpoint({
  method: 'GET', path: '/api/invitations/:token', access: 'public',
  summary: 'An open invitation: who it is for, the role, the business.',
  params: tokenParams,
  response: z.object({ email: z.string(), role: z.enum(ROLES), businessName: z.string() }),
});

export const acceptInvitation = endpoint({
  method: 'POST', path: '/api/invitations/:token/accept', access: 'public',
  summary: 'Accepts an invitation with a name and password; answers the new session.',
  params: tokenParams, body: acceptInviteSchema, response: sessionSchema, status: 201,
  errors: { 409: '`email_taken`' },
});

export { email };

// ISO 4217 codes as the runtime's Intl knows them.
const CURRENCIES = new Set(Intl.supportedValuesOf('currency'));
export const countryCode = z
  .string({ error: 'Use a two-letter country code, e.g. GB or US.' })
  .transform((s) => s.trim().toUpperCase())
  .pipe(z.string().regex(/^[A-Z]{2}$/, 'Use a two-letter country code, e.g. GB or US.'));
export const currencyCode = z
  .string({ error: 'Use a three-letter currency code, e.g. GBP.' })
  .transform((s) => s.trim().toUpperCase())
  .pipe(z.string().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code, e.g. GBP.').refine((c) => CURRENCIES.has(c), 'Unknown currency code.'));
export const timeZone = z
  .string({ error: 'Choose a time zone.' })
  .max(64, 'Choose a time zone.')
  .refine((tz) => {
    try {
      return /^[A-Za-z_]+(\/[A-Za-z0-9_+-]+)*$/.test(tz) && new Intl.DateTimeFormat('en', { timeZone: tz }).resolvedOptions().timeZone.length > 0;
    } catch {
      return false;
    }
  }, 'Choose a time zone such as Europe/London.');
export const taxMode = z.enum(TAX_MODES, { error: 'Choose whether menu prices include tax.' });
export const taxName = text({ min: 1, max: 40 }).pipe(z.string().min(1, 'Name the tax (VAT, GST, sales tax).'));
/** A tax rate in %, 0 to 100 with at most 4 decimals (the pricing policy's numeric(7, 4)); a plain check, no decimal.js. */
export const taxRatePct = z
  .string({ error: 'Enter the rate as a number, e.g. 20.' })
  .regex(/^\d{1,3}(\.\d{1,4})?$/, 'Enter the rate as a number, e.g. 20 or 6.25.')
  .refine((s) => Number(s) <= 100, 'A rate is at most 100 %.');

export const signupSchema = z.object({
  name: text({ what: 'person', min: 1, max: 120 }).pipe(z.string().min(1, 'Enter your name.')),
  email,
  password,
  businessName: text({ min: 1, max: 120 }).pipe(z.string().min(1, 'Enter the business name.')),
  siteName: text({ min: 1, max: 120 }).pipe(z.string().min(1, 'Name your first café.')),
  country: countryCode.default('GB'),
  currency: currencyCode,
  taxMode,
  /** The browser's time zone at sign-up; the owner can change it in the settings. */
  timeZone: timeZone.optional(),
  /** The tax's name there; the country's own when left out. */
  taxName: taxName.optional(),
  /** The tax rate menu prices are worked out with; the country's standard rate when left out (0 where there is none). */
  taxRatePct: taxRatePct.optional(),
});

export const signup = endpoint({
  method: 'POST', path: '/api/auth/signup', access: 'public',
  summary: 'Opens a business with its first site and its owner, and signs the owner in.',
  body: signupSchema, response: sessionSchema, status: 201,
  errors: { 409: '`email_taken`' },
});
export type TaxMode = (typeof TAX_MODES)[number];
