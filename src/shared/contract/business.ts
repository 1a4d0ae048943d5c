import { z } from 'zod';
import { nameOf } from '../schemas/basic-fields';
import { businessSchema, countryCode, currencyCode, taxMode, taxName, timeZone } from './auth';
import { endpoint } from './endpoint';

export const businessPatchSchema = z
  .object({ name: nameOf('business'), country: countryCode, currency: currencyCode, taxMode, taxName, timeZone })
  .partial();

export const getBusiness = endpoint({
  method: 'GET', path: '/api/business', access: 'sites.read',
  summary: 'The business: name, country, currency, whether menu prices include tax, time zone.',
  response: z.object({ business: businessSchema }),
});

export const updateBusiness = endpoint({
  method: 'PATCH', path: '/api/business', access: 'business.manage',
  summary: "Changes the business's settings (only the fields sent).",
  body: businessPatchSchema, response: z.object({ business: businessSchema }),
});
