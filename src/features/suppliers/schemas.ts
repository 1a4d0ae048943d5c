import { z } from 'zod';
import { supplierOrderingSchema } from '../../shared/ordering';

const optionalText = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`);

/**
 * The supplier form: the details mirror the server's supplier rules (server/suppliers), the
 * ordering terms are the very schema PUT /api/suppliers/:id/ordering validates with.
 * Optional texts are '' in the form and sent as null.
 */
export const supplierFormSchema = z.object({
  name: z.string().trim().min(1, 'Name the supplier.').max(120, 'Use at most 120 characters.'),
  contactName: optionalText(120),
  orderEmail: z.union([z.literal(''), z.email('Enter an e-mail address for orders.')]),
  phone: optionalText(40),
  accountNumber: optionalText(60),
  notes: optionalText(2000),
  ...supplierOrderingSchema.shape,
});

export type SupplierFormIn = z.input<typeof supplierFormSchema>;
export type SupplierFormOut = z.output<typeof supplierFormSchema>;

/** Short weekday names in the reader's language, for ISO weekdays 1 (Monday) … 7 (Sunday). */
export function weekdayName(isoDay: number, style: 'short' | 'long' = 'short'): string {
  // 1 January 2024 was a Monday.
  return new Intl.DateTimeFormat(undefined, { weekday: style, timeZone: 'UTC' }).format(new Date(Date.UTC(2024, 0, isoDay)));
}
