import { z } from 'zod';
import { ROLES as roles } from '../../shared/capabilities';

// Mirrors the server's invite rules (server/auth/auth.schemas.ts).
export const inviteSchema = z.object({
  email: z.string().trim().toLowerCase().min(1, 'Enter their e-mail address.').pipe(z.email('Enter a valid e-mail address.')),
  role: z.enum(roles, 'Choose a role.'),
});
