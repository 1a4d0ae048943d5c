import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { useCounts } from '../../features/books/api/counts';
import { CountsList, StartCountForm } from '../../features/books/components/counts-list';
import { useWorkSite } from './work-site';

export function StockCountsRoute() {
  const work = useWorkSite();
  const counts = useCounts(work.site?.id);
  return (
    <div className="flex max-w-3xl flex-col gap-6 text-lg">
      <PageHeader title="Stock counts" description="Count what is on the shelves, pack by pack. A count on a month's last day closes that month's stock." />
      {work.pending ? (
        <SkeletonRows rows={2} label="Loading your site" />
      ) : !work.site ? (
        <EmptyState title="No site yet" next="An owner adds the business's sites in Settings; counts are kept per site." />
      ) : (
        <StartCountForm siteId={work.site.id} siteName={work.site.name} />
      )}
      {work.site &&
        (counts.isPending ? (
          <SkeletonRows rows={4} label="Loading counts" />
        ) : counts.isError ? (
          <ErrorState error={counts.error} onRetry={() => counts.refetch()} />
        ) : (
          <CountsList counts={counts.data.counts} currency={counts.data.currency} />
        ))}
    </div>
  );
}
