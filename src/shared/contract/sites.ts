import { z } from 'zod';
import { nameOf } from '../schemas/basic-fields';
import { endpoint } from './endpoint';

export const siteSchema = z.object({ id: z.uuid(), name: z.string() });
export type Site = z.output<typeof siteSchema>;
export const siteInSchema = z.object({ name: nameOf('site') });

export const listSites = endpoint({
  method: 'GET', path: '/api/sites', access: 'sites.read',
  summary: "The business's sites, oldest first.",
  response: z.object({ sites: z.array(siteSchema) }),
});

export const createSite = endpoint({
  method: 'POST', path: '/api/sites', access: 'business.manage',
  summary: 'Adds a site.',
  body: siteInSchema, response: z.object({ site: siteSchema }), status: 201,
});

export const renameSite = endpoint({
  method: 'PATCH', path: '/api/sites/:id', access: 'business.manage',
  summary: 'Renames a site.',
  body: siteInSchema, response: z.object({ site: siteSchema }),
});
