import { useCallback, useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Input, Select } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, Td, THead, useSortedRows } from '../../../components/ui/table';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatQuantity } from '../../../lib/format';
import { stockLevelSchema } from '../../../shared/ordering';
import type { StockItem } from '../api/get-stock';
import type { StorageArea } from '../api/get-storage-areas';
import { useSetPackStorageArea } from '../api/set-pack-storage-area';
import { useUpdateStockLevel } from '../api/update-stock-level';

type SortKey = 'description' | 'supplier' | 'area' | 'onHand' | 'par' | 'reorderPoint' | 'suggested';

/** The pack's storage area, changed as soon as another is chosen. */
function AreaCell({ siteId, item, areas, onChanged }: { siteId: string; item: StockItem; areas: StorageArea[]; onChanged?: () => void }) {
  const set = useSetPackStorageArea(onChanged);
  const { notify } = useToast();
  const [error, setError] = useState<string | null>(null);
  const errorId = `area-error-${item.packId}`;
  return (
    <Td>
      <Select
        aria-label={`Storage area, ${item.description}`}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        className="w-40! py-1"
        value={set.isPending ? (set.variables?.storageAreaId ?? '') : (item.storageArea?.id ?? '')}
        disabled={set.isPending}
        onChange={(e) => {
          const storageAreaId = e.target.value || null;
          setError(null);
          set.mutate(
            { siteId, packId: item.packId, storageAreaId },
            {
              onSuccess: (r) => notify(r.item.storageArea ? `${item.description}: now in ${r.item.storageArea.name}.` : `${item.description}: now in no storage area.`),
              onError: (err) => setError(isApiError(err) ? (Object.values(err.fields)[0] ?? err.message) : 'That did not save. Try again.'),
            },
          );
        }}
      >
        <option value="">No area</option>
        {areas.map((a) => (
          <option key={a.id} value={a.id}>
            {a.name}
          </option>
        ))}
      </Select>
      {error && <p id={errorId} className="mt-1 text-xs font-medium text-rose">{error}</p>}
    </Td>
  );
}

/** Par level and reorder point of one pack, saved on its own; the same rule as the server gives the message. */
function LevelCells({ siteId, item, onSaved }: { siteId: string; item: StockItem; onSaved?: () => void }) {
  const [par, setPar] = useState(item.par);
  const [reorderPoint, setReorderPoint] = useState(item.reorderPoint);
  const [error, setError] = useState<string | null>(null);
  const update = useUpdateStockLevel(onSaved);
  const { notify } = useToast();
  const dirty = par !== item.par || reorderPoint !== item.reorderPoint;
  const errorId = `level-error-${item.packId}`;
  const submit = () => {
    const parsed = stockLevelSchema.safeParse({ par: par.trim(), reorderPoint: reorderPoint.trim() });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? 'Check the figures.');
      return;
    }
    setError(null);
    update.mutate(
      { siteId, packId: item.packId, ...parsed.data },
      {
        onSuccess: () => notify(`Levels saved for ${item.description}.`),
        onError: (err) => setError(isApiError(err) ? Object.values(err.fields)[0] ?? err.message : 'That did not save. Try again.'),
      },
    );
  };
  const onKeyDown = (e: React.KeyboardEvent) => {
    if (e.key === 'Enter') {
      e.preventDefault();
      submit();
    }
  };
  return (
    <>
      <Td figure>
        <Input inputMode="decimal" aria-label={`Par level, ${item.description}`} aria-invalid={error ? true : undefined} aria-describedby={error ? errorId : undefined}
          className="ml-auto w-20! py-1" value={par} onChange={(e) => setPar(e.target.value)} onKeyDown={onKeyDown} />
      </Td>
      <Td figure>
        <Input inputMode="decimal" aria-label={`Reorder point, ${item.description}`} aria-invalid={error ? true : undefined} aria-describedby={error ? errorId : undefined}
          className="ml-auto w-20! py-1" value={reorderPoint} onChange={(e) => setReorderPoint(e.target.value)} onKeyDown={onKeyDown} />
        {error && <p id={errorId} className="mt-1 text-left text-xs font-medium text-rose">{error}</p>}
      </Td>
      <Td className="w-20">
        {dirty && (
          <Button size="sm" variant="secondary" busy={update.isPending} onClick={submit} aria-label={`Save levels for ${item.description}`}>
            Save
          </Button>
        )}
      </Td>
    </>
  );
}

/** Every pack held at the site: on hand, par level, reorder point and what would be ordered. */
export function StockTable({ siteId, items, canEdit, areas, onLevelSaved, onAreaChanged }: {
  siteId: string;
  items: StockItem[];
  canEdit: boolean;
  /** The site's storage areas, for choosing each pack's (owner and manager). */
  areas?: StorageArea[];
  onLevelSaved?: () => void;
  onAreaChanged?: () => void;
}) {
  const [search, setSearch] = useState('');
  const [supplierId, setSupplierId] = useState('');
  const suppliers = useMemo(() => [...new Map(items.filter((i) => i.supplier).map((i) => [i.supplier!.id, i.supplier!.name])).entries()].sort((a, b) => a[1].localeCompare(b[1])), [items]);
  const shown = useMemo(() => {
    const q = search.trim().toLowerCase();
    return items.filter((i) => i.description.toLowerCase().includes(q) && (!supplierId || i.supplier?.id === supplierId));
  }, [items, search, supplierId]);
  const value = useCallback(
    (i: StockItem, key: SortKey) => (key === 'description' ? i.description : key === 'supplier' ? (i.supplier?.name ?? '') : key === 'area' ? (i.storageArea?.name ?? '') : i[key]),
    [],
  );
  const { sorted, sort, onSort } = useSortedRows<StockItem, SortKey>(shown, { key: 'description', direction: 'asc' }, value);

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap gap-4">
        <label className="flex min-w-56 flex-col gap-1 text-sm font-medium text-ink">
          Search packs
          <Input type="search" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="Ingredient or pack" />
        </label>
        <label className="flex min-w-56 flex-col gap-1 text-sm font-medium text-ink">
          Supplier
          <Select value={supplierId} onChange={(e) => setSupplierId(e.target.value)}>
            <option value="">Every supplier</option>
            {suppliers.map(([id, name]) => <option key={id} value={id}>{name}</option>)}
          </Select>
        </label>
      </div>
      {sorted.length === 0 ? (
        <EmptyState title="No pack matches" next="Clear the search or choose every supplier." />
      ) : (
        <Table caption="Stock at this site, in packs">
          <THead>
            <tr>
              <SortHeader label="Pack" sortKey="description" sort={sort} onSort={onSort} />
              <SortHeader label="Supplier" sortKey="supplier" sort={sort} onSort={onSort} />
              <SortHeader label="Area" sortKey="area" sort={sort} onSort={onSort} />
              <SortHeader label="On hand" sortKey="onHand" sort={sort} onSort={onSort} figure />
              <SortHeader label="Par level" sortKey="par" sort={sort} onSort={onSort} figure />
              <SortHeader label="Reorder point" sortKey="reorderPoint" sort={sort} onSort={onSort} figure />
              {canEdit && <th scope="col" className="px-3 py-2"><span className="sr-only">Save</span></th>}
              <SortHeader label="To order" sortKey="suggested" sort={sort} onSort={onSort} figure />
            </tr>
          </THead>
          <tbody>
            {sorted.map((i) => (
              <tr key={i.packId} data-pack={i.packId}>
                <Td>{i.description}</Td>
                <Td>{i.supplier?.name ?? <span className="text-muted">none</span>}</Td>
                {canEdit && areas ? (
                  <AreaCell siteId={siteId} item={i} areas={areas} onChanged={onAreaChanged} />
                ) : (
                  <Td>{i.storageArea?.name ?? <span className="text-muted">none</span>}</Td>
                )}
                <Td figure>
                  {formatQuantity(i.onHand)}
                  {i.atOrBelowReorder && <span className="ml-2"><StatusMark tone="attention">low</StatusMark></span>}
                </Td>
                {canEdit ? (
                  <LevelCells key={`${i.par}/${i.reorderPoint}`} siteId={siteId} item={i} onSaved={onLevelSaved} />
                ) : (
                  <>
                    <Td figure>{formatQuantity(i.par)}</Td>
                    <Td figure>{formatQuantity(i.reorderPoint)}</Td>
                  </>
                )}
                <Td figure>{i.suggested === '0' ? <span className="text-muted">—</span> : formatQuantity(i.suggested)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}
