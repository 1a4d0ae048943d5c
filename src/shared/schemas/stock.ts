import { z } from 'zod';

/** The longest name a storage area may have: it heads a section of the phone count sheet. */
export const STORAGE_AREA_NAME_MAX = 60;

/** A storage area's name, as the business calls the place ("Walk-in fridge", "Under the bar"). */
export const storageAreaName = z
  .string({ error: 'Name the storage area.' })
  .trim()
  .min(1, 'Name the storage area.')
  .max(STORAGE_AREA_NAME_MAX, `Keep the name to ${STORAGE_AREA_NAME_MAX} characters or fewer.`);

export const storageAreaInSchema = z.object({ name: storageAreaName });

export const storageAreaPatchSchema = z.object({ name: storageAreaName.optional() });

/** Every area of the site, once each, in the order the count sheet should walk them. */
export const storageAreaOrderSchema = z.object({
  areaIds: z
    .array(z.uuid({ error: 'Each entry must be an area of this site.' }), { error: 'List the areas in their new order.' })
    .max(200, 'That is more areas than a site can hold.')
    .refine((ids) => new Set(ids).size === ids.length, 'List each area once.'),
});

/** Where a stocked pack is kept: an area of the same site, or none. */
export const packStorageAreaSchema = z.object({
  storageAreaId: z.uuid({ error: 'Choose an area of this site, or none.' }).nullable(),
});
