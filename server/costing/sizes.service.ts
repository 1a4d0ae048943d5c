import type { z } from 'zod';
import type { CupSize, sizeInSchema } from '../../src/shared/contract/costing';
import { guardWrite } from '../platform/db-errors';
import type { AppDeps } from '../platform/deps';
import { notFound } from '../platform/errors';
import { presentSize } from './costing.presenter';
import { deleteSize, insertSize, listSizes, updateSize, type SizeColumns } from './sizes.repo';

type SizeIn = Partial<z.output<typeof sizeInSchema>>;

function columns(s: SizeIn): SizeColumns {
  const out: SizeColumns = {};
  if (s.name !== undefined) out.name = s.name;
  if (s.volumeMl !== undefined) out.volume_ml = s.volumeMl;
  if (s.position !== undefined) out.position = s.position;
  return out;
}

export async function list({ db }: AppDeps, businessId: string): Promise<CupSize[]> {
  return (await listSizes(db, businessId)).map(presentSize);
}

export async function create({ db }: AppDeps, businessId: string, input: SizeIn): Promise<CupSize> {
  return presentSize(await guardWrite('A cup size', () => insertSize(db, businessId, { position: 0, ...columns(input) })));
}

export async function update({ db }: AppDeps, businessId: string, id: string, input: SizeIn): Promise<CupSize> {
  const row = await guardWrite('A cup size', () => updateSize(db, businessId, id, columns(input)));
  if (!row) throw notFound('That cup size');
  return presentSize(row);
}

export async function remove({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  const n = await guardWrite('That cup size', () => deleteSize(db, businessId, id));
  if (!n) throw notFound('That cup size');
}
