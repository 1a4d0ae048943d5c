import { z } from 'zod';
import { nameOf, optionalEmail, optionalText } from '../schemas/basic-fields';
import { endpoint } from './endpoint';

/** A supplier as every supplier route answers it: its details and its ordering terms. */
export const supplierSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  contactName: z.string().nullable(),
  orderEmail: z.string().nullable(),
  phone: z.string().nullable(),
  accountNumber: z.string().nullable(),
  notes: z.string().nullable(),
  paymentTerms: z.enum(['card', 'account']),
  /** Money in the business's currency ("40.00"). */
  minimumOrder: z.string(),
  /** ISO weekdays, 1 = Monday … 7 = Sunday. */
  deliveryDays: z.array(z.number().int()),
  orderCutoff: z.string(),
  leadDays: z.number().int(),
  deliveryCharge: z.string(),
});
export type Supplier = z.output<typeof supplierSchema>;

/** The supplier's details (its ordering terms have their own route). */
export const supplierDetailsSchema = z.object({
  name: nameOf('supplier'),
  contactName: optionalText(120, false),
  orderEmail: optionalEmail,
  phone: optionalText(40, false),
  accountNumber: optionalText(60, false),
  notes: optionalText(),
});
export type SupplierDetailsIn = z.input<typeof supplierDetailsSchema>;

const one = z.object({ supplier: supplierSchema });

export const listSuppliers = endpoint({
  method: 'GET', path: '/api/suppliers', access: 'costs.read',
  summary: 'Every supplier of the business, by name.',
  response: z.object({ suppliers: z.array(supplierSchema) }),
});

export const getSupplier = endpoint({
  method: 'GET', path: '/api/suppliers/:id', access: 'costs.read',
  summary: 'One supplier with its ordering terms.',
  response: one,
});

export const createSupplier = endpoint({
  method: 'POST', path: '/api/suppliers', access: 'costs.write',
  summary: 'Adds a supplier.',
  body: supplierDetailsSchema, response: one, status: 201,
  errors: { 409: '`name_taken`: a supplier of that name exists' },
});

export const updateSupplier = endpoint({
  method: 'PATCH', path: '/api/suppliers/:id', access: 'costs.write',
  summary: "Changes a supplier's details (only the fields sent).",
  body: supplierDetailsSchema.partial(), response: one,
  errors: { 409: '`name_taken`' },
});

export const deleteSupplier = endpoint({
  method: 'DELETE', path: '/api/suppliers/:id', access: 'costs.write',
  summary: 'Removes a supplier no pack is bought from.',
  response: null,
  errors: { 409: '`in_use`: packs are still bought from this supplier' },
});
