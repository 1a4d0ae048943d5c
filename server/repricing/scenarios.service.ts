import type { Knex } from 'knex';
import type { ScenarioInput } from '../../src/shared/schemas/repricing';
import { guardWrite } from '../platform/db-errors';
import { conflict, notFound } from '../platform/errors';
import { previewImpact, type Impact } from './impact.service';
import { findScenario, findScenarios, listScenarios, type ScenarioRow } from './repricing.repo';

function present(r: ScenarioRow) {
  return {
    id: r.id,
    name: r.name,
    notes: r.notes,
    changes: r.changes,
    asOf: r.prices_as_of,
    decisions: r.decisions,
    keepLadder: r.keep_ladder,
    status: r.status,
    effectiveFrom: r.effective_from,
    createdBy: r.created_by_name,
    createdAt: new Date(r.created_at).toISOString(),
    updatedAt: new Date(r.updated_at).toISOString(),
    appliedBy: r.applied_by_name,
    appliedAt: r.applied_at ? new Date(r.applied_at).toISOString() : null,
  };
}

const impactOf = (db: Knex, businessId: string, s: { changes: ScenarioRow['changes']; prices_as_of: string | null; decisions: ScenarioRow['decisions']; keep_ladder: boolean }) =>
  previewImpact(db, businessId, { changes: s.changes, asOf: s.prices_as_of ?? undefined, decisions: s.decisions, keepLadder: s.keep_ladder });

/** The price versions the scenario was worked out against: the apply's version check. */
function snapshotOf(impact: Impact): Record<string, number> {
  const out: Record<string, number> = {};
  for (const r of impact.rows) out[r.drinkSizeId] = r.priceVersion;
  for (const p of impact.prices) out[p.drinkSizeId] = p.priceVersion;
  return out;
}

function columns(input: ScenarioInput, impact: Impact) {
  return {
    name: input.name,
    notes: input.notes ?? null,
    changes: JSON.stringify(input.changes),
    prices_as_of: input.asOf ?? null,
    decisions: JSON.stringify(input.decisions),
    keep_ladder: input.keepLadder,
    snapshot: JSON.stringify(snapshotOf(impact)),
  };
}

export async function listAll(db: Knex, businessId: string) {
  return { scenarios: (await listScenarios(db, businessId)).map(present) };
}

/** A scenario with its impact worked out now (a draft) or the prices it set (applied). */
export async function getOne(db: Knex, businessId: string, id: string) {
  const row = await findScenario(db, businessId, id);
  if (!row) throw notFound('That scenario');
  if (row.status === 'applied') {
    return { scenario: present(row), impact: null };
  }
  return { scenario: present(row), impact: await impactOf(db, businessId, row) };
}

export async function create(db: Knex, businessId: string, userId: string, input: ScenarioInput) {
  const impact = await previewImpact(db, businessId, { changes: input.changes, asOf: input.asOf ?? undefined, decisions: input.decisions, keepLadder: input.keepLadder });
  const [row] = await guardWrite('A scenario', () =>
    db('reprice_scenarios')
      .insert({ business_id: businessId, ...columns(input, impact), created_by: userId })
      .returning('id'),
  );
  const saved = await findScenario(db, businessId, row.id);
  return { scenario: present(saved as ScenarioRow), impact };
}

export async function replace(db: Knex, businessId: string, id: string, input: ScenarioInput) {
  const row = await findScenario(db, businessId, id);
  if (!row) throw notFound('That scenario');
  if (row.status === 'applied') throw conflict('already_applied', `The scenario "${row.name}" was applied and can no longer change. Save a new one.`);
  const impact = await previewImpact(db, businessId, { changes: input.changes, asOf: input.asOf ?? undefined, decisions: input.decisions, keepLadder: input.keepLadder });
  await guardWrite('A scenario', () =>
    db('reprice_scenarios')
      .where({ business_id: businessId, id, status: 'draft' })
      .update({ ...columns(input, impact), updated_at: db.fn.now() }),
  );
  const saved = await findScenario(db, businessId, id);
  return { scenario: present(saved as ScenarioRow), impact };
}

export async function remove(db: Knex, businessId: string, id: string) {
  const row = await findScenario(db, businessId, id);
  if (!row) throw notFound('That scenario');
  if (row.status === 'applied') throw conflict('already_applied', 'An applied scenario stays: the price history points at it.');
  await db('reprice_scenarios').where({ business_id: businessId, id }).delete();
}

/**
 * Scenarios side by side: each one's totals, and per drink size the price and margin each
 * would give (null where that scenario does not touch the size).
 */
export async function compare(db: Knex, businessId: string, ids: readonly string[]) {
  const found = await findScenarios(db, businessId, ids);
  const byId = new Map(found.map((r) => [r.id, r]));
  const ordered = [...new Set(ids)].map((id) => {
    const r = byId.get(id);
    if (!r) throw notFound('One of those scenarios');
    return r;
  });
  const impacts = await Promise.all(ordered.map((r) => impactOf(db, businessId, r)));
  const rows = new Map<string, { drinkId: string; drinkName: string; drinkSizeId: string; size: string; currentPrice: string | null; cells: (null | { newCost: string | null; newPrice: string | null; marginPct: string | null; belowTarget: boolean })[] }>();
  impacts.forEach((impact, k) => {
    for (const r of impact.rows) {
      let row = rows.get(r.drinkSizeId);
      if (!row) {
        row = { drinkId: r.drinkId, drinkName: r.drinkName, drinkSizeId: r.drinkSizeId, size: r.size, currentPrice: r.currentPrice, cells: ordered.map(() => null) };
        rows.set(r.drinkSizeId, row);
      }
      row.cells[k] = { newCost: r.newCost, newPrice: r.newPrice, marginPct: r.newPriceMarginPct, belowTarget: r.newPriceBelowTarget };
    }
  });
  return {
    currency: impacts[0]?.currency ?? null,
    scenarios: ordered.map((r, k) => ({ ...present(r), totals: impacts[k].totals })),
    rows: [...rows.values()].sort((a, b) => a.drinkName.localeCompare(b.drinkName)),
  };
}
