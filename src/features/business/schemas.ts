import { z } from 'zod';

// Mirrors the business fields of the server's signup rules.
export const businessSchema = z.object({
  name: z.string().trim().min(1, 'Enter the business name.').max(120, 'Use at most 120 characters.'),
  country: z.string().trim().toUpperCase().regex(/^[A-Z]{2}$/, 'Choose the country the business trades in.'),
  currency: z.string().trim().toUpperCase().regex(/^[A-Z]{3}$/, 'Choose the currency your prices are in.'),
  taxMode: z.enum(['inclusive', 'exclusive'], 'Choose whether menu prices include tax.'),
});
