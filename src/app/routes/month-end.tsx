import { useSearchParams } from 'react-router-dom';
import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { Field } from '../../components/ui/field';
import { Input, Select } from '../../components/ui/input';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { hrefOf } from '../../lib/contract';
import { cogsCsv, purchasesCsv, stockValuationCsv } from '../../shared/contract/books';
import { useCogs } from '../../features/books/api/reports';
import { CategoryChart, CogsTrendChart, SupplierChart } from '../../features/books/components/cogs-charts';
import { CogsSummary, CogsTable } from '../../features/books/components/cogs-table';
import { MonthClose } from '../../features/books/components/month-close';
import { useWorkSite } from './work-site';
import { buttonClasses } from '../../components/ui/button';

function lastMonth(): string {
  const d = new Date();
  d.setUTCDate(1);
  d.setUTCMonth(d.getUTCMonth() - 1);
  return d.toISOString().slice(0, 7);
}

export function MonthEndRoute() {
  const [params, setParams] = useSearchParams();
  const month = /^\d{4}-\d{2}$/.test(params.get('month') ?? '') ? (params.get('month') as string) : lastMonth();
  const scope = params.get('scope') === 'all' ? 'all' : 'site';
  const work = useWorkSite();
  const siteId = scope === 'all' ? null : (work.site?.id ?? null);
  const ready = !work.pending && (scope === 'all' || siteId !== null);
  const report = useCogs(month, siteId);
  const set = (k: string, v: string) => setParams((p) => { const n = new URLSearchParams(p); n.set(k, v); return n; }, { replace: true });
  const ended = month < new Date().toISOString().slice(0, 7);

  return (
    <div className="flex max-w-7xl flex-col gap-6">
      <PageHeader
        title="Month end"
        description="Cost of goods for a month: opening stock plus purchases less closing stock, against what the recipes say the cups sold should have cost."
        action={
          ready && (
            <div className="flex flex-wrap gap-2">
              <a className={buttonClasses('primary')} href={hrefOf(cogsCsv, { query: { month, siteId: siteId ?? undefined } })} download>Download cost of goods (CSV)</a>
              <a className={buttonClasses('secondary')} href={hrefOf(purchasesCsv, { query: { month, siteId: siteId ?? undefined } })} download>Purchases ledger (CSV)</a>
            </div>
          )
        }
      />
      <Card className="flex flex-wrap items-end gap-4 p-4">
        <Field label="Month" className="w-44">
          <Input type="month" value={month} max={new Date().toISOString().slice(0, 7)} onChange={(e) => e.target.value && set('month', e.target.value)} />
        </Field>
        <Field label="Figures for" className="w-56">
          <Select value={scope} onChange={(e) => set('scope', e.target.value)}>
            <option value="site">{work.site ? work.site.name : 'This site'}</option>
            <option value="all">All sites</option>
          </Select>
        </Field>
      </Card>
      {!ready || report.isPending ? (
        <SkeletonRows rows={8} label="Working out the month" />
      ) : report.isError ? (
        <ErrorState error={report.error} onRetry={() => report.refetch()} />
      ) : (
        <>
          <MonthClose month={month} closed={report.data.closed} role={work.role} ended={ended} />
          <CogsSummary report={report.data} />
          {report.data.notes.length > 0 && (
            <div role="note" className="rounded-lg border border-butter bg-butter/20 p-4 text-sm">
              <p className="font-medium">Before you rely on these figures</p>
              <ul className="mt-1 list-disc pl-5">
                {report.data.notes.map((n) => <li key={n}>{n}</li>)}
              </ul>
            </div>
          )}
          {report.data.rows.length === 0 ? (
            <EmptyState title="Nothing recorded for this month" next="Count the stock at the month's end, receive the deliveries and import the till's sales; the cost of goods appears here." />
          ) : (
            <CogsTable report={report.data} />
          )}
          <p className="text-sm text-muted">
            Stock is valued at the pack price in force on the count date; purchases are deliveries received in the month, net of purchase tax.
            Tax treatment of purchases and sales depends on where you trade: check it with your accountant or the tax authority.
          </p>
          <div className="grid gap-4 lg:grid-cols-2">
            <CogsTrendChart month={month} siteId={siteId} />
            <SupplierChart month={month} siteId={siteId} currency={report.data.currency} />
            {report.data.rows.length > 0 && <CategoryChart report={report.data} />}
          </div>
          {report.data.counts.closing.length > 0 && (
            <p className="text-sm">
              Stock valuation at the closing count:{' '}
              {report.data.counts.closing.map((c) => (
                <a key={c.countId} className="mr-3 underline decoration-copper" href={hrefOf(stockValuationCsv, { query: { countId: c.countId } })} download>
                  {work.sites.find((s) => s.id === c.siteId)?.name ?? 'site'} ({c.countDate}, CSV)
                </a>
              ))}
            </p>
          )}
        </>
      )}
    </div>
  );
}
