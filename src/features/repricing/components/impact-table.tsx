import { Fragment, useCallback, useMemo, useState } from 'react';
import { TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Input, Select } from '../../../components/ui/input';
import { Table, TableFilters, TableSearch, Td, Th, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import { paths } from '../../../lib/paths';
import type { Choice, Decision, Impact, ImpactRow } from '../api/types';
import { Money, Pct, TargetMark } from './figures';

interface Props {
  impact: Impact;
  decisions: ReadonlyMap<string, Decision>;
  onDecide: (d: Decision) => void;
  readOnly?: boolean;
}

function how(r: ImpactRow): string {
  const parts = [];
  if (r.via.includes('direct')) parts.push(r.ingredients.join(', '));
  if (r.through.length) parts.push(`through ${r.through.join(', ')}`);
  return parts.join('; ');
}

type SortKey = 'drink' | 'oldCost' | 'newCost' | 'costChange' | 'currentPrice' | 'oldMarginPct' | 'newMarginPct' | 'target' | 'suggestedPrice' | 'weeklyCups' | 'weeklyCostIncrease';
type Show = '' | 'below' | 'on';

/** Below target first, then on target, then sizes with no price. */
const targetRank = (r: ImpactRow) => (r.belowTarget ? 0 : r.currentPrice !== null ? 1 : 2);

/**
 * Every affected drink × size: cost before and after, the margin at today's price before and
 * after with the target mark, the suggested price, the money at the weekly mix, and what to do.
 */
export function ImpactTable({ impact, decisions, onDecide, readOnly }: Props) {
  const { currency } = impact;
  const [search, setSearch] = useState('');
  const [show, setShow] = useState<Show>('');
  const shown = useMemo(
    () => impact.rows.filter((r) => (!show || r.belowTarget === (show === 'below')) && matchesSearch(search, r.drinkName, r.size, r.category, ...r.ingredients, ...r.through)),
    [impact.rows, search, show],
  );
  const value = useCallback((r: ImpactRow, key: SortKey) => (key === 'drink' ? `${r.drinkName} ${r.size}` : key === 'target' ? targetRank(r) : r[key]), []);
  // The server's order (most margin lost first) until a header is chosen. The new price and
  // its margin are not sortable: they change as the owner decides, and rows would jump.
  const { sorted, sort, header } = useSortedRows<ImpactRow, SortKey>(shown, null, value);
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={impact.rows.length}>
        <TableSearch label="Search affected drinks" value={search} onChange={setSearch} placeholder="Drink, size or ingredient" />
        <Field label="Show sizes" className="w-56">
          <Select value={show} onChange={(e) => setShow(e.target.value as Show)}>
            <option value="">Every size affected</option>
            <option value="below">Below target after</option>
            <option value="on">Not below target after</option>
          </Select>
        </Field>
      </TableFilters>
      {sorted.length === 0 ? (
        <EmptyState title="No affected size matches" next="Clear the search or show every size affected." />
      ) : (
        <Table caption={sort ? 'Drinks and sizes affected' : 'Drinks and sizes affected, most margin lost first'}>
          <THead>
            <tr>
              {header('drink', 'Drink and size', false)}
              {header('oldCost', 'Cost before')}
              {header('newCost', 'Cost after')}
              {header('costChange', 'Change')}
              {header('currentPrice', 'Price now')}
              {header('oldMarginPct', 'Margin before')}
              {header('newMarginPct', 'Margin after')}
              {header('target', 'Target', false)}
              {header('suggestedPrice', 'Suggested')}
              {header('weeklyCups', 'Cups a week')}
              {header('weeklyCostIncrease', 'Cost a week')}
              <Th>New price</Th>
              <Th figure>Margin at new price</Th>
            </tr>
          </THead>
          <tbody>
            {sorted.map((r) => {
              const d = decisions.get(r.drinkSizeId);
              const choice: Choice = d?.choice ?? 'keep';
              const label = `${r.drinkName}, ${r.size}`;
              return (
                <Fragment key={r.drinkSizeId}>
                  <tr data-row={label} className={r.belowTarget ? 'bg-rose/5' : undefined}>
                    <Td className="min-w-40">
                      <div className="font-medium">
                        <TextLink to={paths.priceHistory.href(r.drinkId)} title="Price history of this drink">
                          {r.drinkName}
                        </TextLink>{' '}
                        <span className="font-normal">· {r.size}</span>
                      </div>
                      <div className="text-xs text-muted">{how(r)}</div>
                      {r.problem && <div className="text-xs font-medium text-rose">{r.problem}</div>}
                    </Td>
                    <Td figure><Money value={r.oldCost} currency={currency} detail /></Td>
                    <Td figure><Money value={r.newCost} currency={currency} detail /></Td>
                    <Td figure>
                      <Money value={r.costChange} currency={currency} detail />
                      <div className="text-xs text-muted"><Pct value={r.costChangePct} /></div>
                    </Td>
                    <Td figure><Money value={r.currentPrice} currency={currency} /></Td>
                    <Td figure><Pct value={r.oldMarginPct} /></Td>
                    <Td figure><Pct value={r.newMarginPct} /></Td>
                    <Td>
                      <TargetMark below={r.belowTarget} hasPrice={r.currentPrice !== null} />
                      <div className="text-xs text-muted">target <Pct value={r.targetMarginPct} /></div>
                    </Td>
                    <Td figure><Money value={r.suggestedPrice} currency={currency} /></Td>
                    <Td figure>
                      {r.weeklyCups ?? '—'}
                      {r.cupsSource && <div className="text-xs text-muted">{r.cupsSource === 'sales' ? 'from sales' : 'expected'}</div>}
                    </Td>
                    <Td figure><Money value={r.weeklyCostIncrease} currency={currency} /></Td>
                    <Td>
                      {readOnly ? (
                        <Money value={r.newPrice} currency={currency} />
                      ) : (
                        <div className="flex min-w-40 flex-col gap-1">
                          <Select
                            aria-label={`What to do with the price of ${label}`}
                            value={choice}
                            onChange={(e) => onDecide({ drinkSizeId: r.drinkSizeId, choice: e.target.value as Choice, price: e.target.value === 'price' ? (d?.price ?? r.currentPrice ?? '') : undefined })}
                          >
                            <option value="keep">Keep the current price</option>
                            <option value="suggested" disabled={!r.suggestedPrice}>Take the suggested price</option>
                            <option value="price">Type a price</option>
                          </Select>
                          {choice === 'price' ? (
                            <Input
                              aria-label={`New price for ${label}`}
                              inputMode="decimal"
                              defaultValue={d?.price ?? ''}
                              onBlur={(e) => onDecide({ drinkSizeId: r.drinkSizeId, choice: 'price', price: e.target.value.trim() })}
                              onKeyDown={(e) => {
                                if (e.key === 'Enter') onDecide({ drinkSizeId: r.drinkSizeId, choice: 'price', price: e.currentTarget.value.trim() });
                              }}
                            />
                          ) : (
                            <span className="text-right text-sm tabular-nums">
                              <Money value={r.newPrice} currency={currency} />
                            </span>
                          )}
                        </div>
                      )}
                    </Td>
                    <Td figure>
                      <Pct value={r.newPriceMarginPct} />
                      {r.newPrice !== null && r.newPriceBelowTarget && <div className="mt-1"><TargetMark below /></div>}
                    </Td>
                  </tr>
                </Fragment>
              );
            })}
          </tbody>
        </Table>
      )}
    </div>
  );
}
