import type { Knex } from 'knex';

export interface SizeRow {
  id: string;
  name: string;
  volume_ml: string;
  position: number;
}

const COLUMNS = ['id', 'name', 'volume_ml', 'position'];

export type SizeColumns = Partial<Pick<SizeRow, 'name' | 'volume_ml' | 'position'>>;

export async function listSizes(db: Knex, businessId: string): Promise<SizeRow[]> {
  return db('cup_sizes').where({ business_id: businessId }).orderBy([{ column: 'position' }, { column: 'volume_ml' }]).select(COLUMNS);
}

export async function insertSize(db: Knex, businessId: string, values: SizeColumns): Promise<SizeRow> {
  const [row] = await db('cup_sizes').insert({ business_id: businessId, ...values }).returning(COLUMNS);
  return row;
}

export async function updateSize(db: Knex, businessId: string, id: string, values: SizeColumns): Promise<SizeRow | undefined> {
  const [row] = await db('cup_sizes').where({ business_id: businessId, id }).update({ ...values, updated_at: db.fn.now() }).returning(COLUMNS);
  return row;
}

export async function deleteSize(db: Knex, businessId: string, id: string): Promise<number> {
  return db('cup_sizes').where({ business_id: businessId, id }).delete();
}

/** Which of these ids are cup sizes of the business. */
export async function knownSizeIds(db: Knex, businessId: string, ids: readonly string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const rows = await db('cup_sizes').where({ business_id: businessId }).whereIn('id', [...new Set(ids)]).select('id');
  return new Set(rows.map((r) => r.id as string));
}
