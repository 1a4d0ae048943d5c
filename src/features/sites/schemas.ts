import { z } from 'zod';

export const siteNameSchema = z.object({
  name: z.string().trim().min(1, 'Give the site a name.').max(120, 'Use at most 120 characters.'),
});
