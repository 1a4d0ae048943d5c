import { useMemo } from 'react';
import { CardSection } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { useImports } from '../../features/books/api/sales-import';
import { useSalesDays } from '../../features/books/api/sales-days';
import { localMonth } from '../../features/books/components/dates';
import { ManualSales } from '../../features/books/components/manual-sales';
import { ImportsList, SalesDaysTable } from '../../features/books/components/sales-lists';
import { TillImport } from '../../features/books/components/till-import';
import { useMenuCosting } from '../../features/costing/api/queries';
import { useWorkSite } from './work-site';

export function TillSalesRoute() {
  const work = useWorkSite();
  const siteId = work.site?.id;
  const imports = useImports(siteId);
  const days = useSalesDays(siteId, localMonth());
  const menu = useMenuCosting();
  const drinkSizes = useMemo(() => (menu.data?.drinks ?? []).flatMap((d) => d.sizes.map((s) => ({ id: s.drinkSizeId, label: `${d.name} (${s.name})` }))), [menu.data]);

  if (work.pending) return <SkeletonRows rows={4} label="Loading your site" />;
  if (!work.site) return <EmptyState title="No site yet" next="An owner adds the business's sites in Settings; sales are kept per site." />;
  return (
    <div className="flex max-w-5xl flex-col gap-6">
      <PageHeader title="Till sales" description={`What ${work.site.name} sold, from the till's CSV file or typed in by hand. It gives the cups behind the month's theoretical cost and the net sales.`} />
      <CardSection title="Import a till file">
        <TillImport siteId={work.site.id} />
      </CardSection>
      <CardSection title="Till files">
        {imports.isPending ? <SkeletonRows rows={3} label="Loading till files" /> : imports.isError ? <ErrorState error={imports.error} onRetry={() => imports.refetch()} /> : <ImportsList imports={imports.data.imports} />}
      </CardSection>
      <CardSection title="This month by day">
        {days.isPending ? <SkeletonRows rows={5} label="Loading sales" /> : days.isError ? <ErrorState error={days.error} onRetry={() => days.refetch()} /> : <SalesDaysTable days={days.data.days} currency={days.data.currency} />}
      </CardSection>
      <CardSection title="Enter a day's sales by hand">
        {menu.isPending ? (
          <SkeletonRows rows={2} label="Loading drinks" />
        ) : menu.isError ? (
          <ErrorState error={menu.error} onRetry={() => menu.refetch()} />
        ) : (
          <ManualSales siteId={work.site.id} drinkSizes={drinkSizes} currency={menu.data.currency} />
        )}
      </CardSection>
    </div>
  );
}
