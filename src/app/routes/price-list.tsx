import { useState } from 'react';
import { Button } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { Field } from '../../components/ui/field';
import { Input, Select } from '../../components/ui/input';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { usePriceList } from '../../features/repricing/api/get-price-list';
import { PriceListSheet } from '../../features/repricing/components/price-list-sheet';

export function PriceListRoute() {
  const [date, setDate] = useState(() => new Date().toISOString().slice(0, 10));
  const list = usePriceList(date || undefined);
  const [paper, setPaper] = useState<'any' | 'a4' | 'letter'>('any');
  return (
    <div className={paper === 'a4' ? 'print-a4' : paper === 'letter' ? 'print-letter' : undefined}>
      <PageHeader
        title="Price list"
        description="The prices for the counter on the day you choose (scheduled prices included), with allergen marks, ready to print or download."
        action={
          <div className="flex flex-wrap items-end gap-3">
            <Field label="Prices on" className="w-44">
              <Input type="date" value={date} onChange={(e) => setDate(e.target.value)} />
            </Field>
            <Field label="Paper" className="w-40">
              <Select value={paper} onChange={(e) => setPaper(e.target.value as typeof paper)}>
                <option value="any">Printer&apos;s default</option>
                <option value="a4">A4</option>
                <option value="letter">US Letter</option>
              </Select>
            </Field>
            <a className="rounded-md border border-rule bg-card px-4 py-2 text-sm font-medium text-ink hover:border-muted" href={paths.api.priceListCsv(date || undefined)} download>
              Download CSV
            </a>
            <Button onClick={() => globalThis.print()}>Print</Button>
          </div>
        }
      />
      {list.isPending ? <SkeletonRows rows={6} label="Loading the price list" /> : list.isError ? <ErrorState error={list.error} onRetry={() => list.refetch()} /> : <PriceListSheet list={list.data} />}
    </div>
  );
}
