import type { z } from 'zod';
import { supplierDetailsSchema } from '../../shared/contract/suppliers';
import { supplierOrderingSchema } from '../../shared/ordering';

/**
 * The supplier form: the very schemas the server validates the supplier's details
 * (POST/PATCH /api/suppliers) and its ordering terms (PUT /api/suppliers/:id/ordering) with.
 * Optional texts are '' in the form and reach the server as null.
 */
export const supplierFormSchema = supplierDetailsSchema.extend(supplierOrderingSchema.shape);

export type SupplierFormIn = z.input<typeof supplierFormSchema>;
export type SupplierFormOut = z.output<typeof supplierFormSchema>;

/** Short weekday names in the reader's language, for ISO weekdays 1 (Monday) … 7 (Sunday). */
export function weekdayName(isoDay: number, style: 'short' | 'long' = 'short'): string {
  // 1 January 2024 was a Monday.
  return new Intl.DateTimeFormat(undefined, { weekday: style, timeZone: 'UTC' }).format(new Date(Date.UTC(2024, 0, isoDay)));
}
