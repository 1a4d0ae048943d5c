import { useId, useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Input } from '../../../components/ui/input';
import { formatMoney } from '../../../lib/format';
import type { CataloguePack } from '../api/types';

/** Search the supplier's catalogue and add a pack to the order (packs already on it are left out). */
export function PackPicker({ packs, taken, currency, onPick }: { packs: CataloguePack[]; taken: ReadonlySet<string>; currency: string; onPick: (pack: CataloguePack) => void }) {
  const [search, setSearch] = useState('');
  const id = useId();
  const matches = useMemo(() => {
    const words = search.trim().toLowerCase().split(/\s+/).filter(Boolean);
    return packs.filter((p) => !taken.has(p.id) && words.every((w) => `${p.description} ${p.supplierCode ?? ''}`.toLowerCase().includes(w)));
  }, [packs, taken, search]);
  const shown = matches.slice(0, 8);
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={id} className="text-sm font-medium text-ink">Find a pack to add</label>
      <Input id={id} type="search" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="Ingredient, pack or supplier code" aria-controls={`${id}-results`}
        onKeyDown={(e) => {
          // Enter adds the first match rather than submitting the order.
          if (e.key === 'Enter') {
            e.preventDefault();
            if (shown[0]) {
              onPick(shown[0]);
              setSearch('');
            }
          }
        }}
      />
      <ul id={`${id}-results`} aria-label="Packs from this supplier" className="flex flex-col divide-y divide-rule rounded-md border border-rule bg-card">
        {shown.length === 0 ? (
          <li className="px-3 py-2 text-sm text-muted">{packs.length === taken.size ? 'Every pack from this supplier is on the order.' : 'No pack matches the search.'}</li>
        ) : (
          shown.map((p) => (
            <li key={p.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
              <span className="min-w-0 text-sm text-ink">
                {p.description}
                {p.supplierCode && <span className="ml-2 text-xs text-muted">code {p.supplierCode}</span>}
              </span>
              <span className="flex items-center gap-3">
                <span className="text-sm tabular-nums text-ink">{p.price ? formatMoney(p.price, currency) : <span className="text-rose">no price</span>}</span>
                <Button size="sm" variant="secondary" disabled={!p.price} onClick={() => { onPick(p); setSearch(''); }} aria-label={`Add ${p.description}`}>
                  Add
                </Button>
              </span>
            </li>
          ))
        )}
        {matches.length > shown.length && <li className="px-3 py-2 text-xs text-muted">{matches.length - shown.length} more: narrow the search.</li>}
      </ul>
    </div>
  );
}
