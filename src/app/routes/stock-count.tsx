import { useParams } from 'react-router-dom';
import { TextLink } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { formatDate } from '../../lib/format';
import { paths } from '../../lib/paths';
import { useCountSheet } from '../../features/books/api/counts';
import { CountSheetView } from '../../features/books/components/count-sheet';
import { can } from '../../shared/capabilities';
import { useWorkSite } from './work-site';

export function StockCountRoute() {
  const { countId = '' } = useParams();
  const sheet = useCountSheet(countId);
  const work = useWorkSite();
  const count = sheet.data?.count;
  return (
    <div className="flex max-w-3xl flex-col gap-4">
      <TextLink to={paths.stockCounts.href()} className="self-start text-base">
        ← All stock counts
      </TextLink>
      <PageHeader
        title={count ? `Stock count, ${formatDate(count.countDate)}` : 'Stock count'}
        description={count ? (count.status === 'finished' ? `${count.siteName}. This count is finished and can no longer change.` : `${count.siteName}. Each line saves as you go: whole packs and the open pack, or the amount on hand.`) : undefined}
      />
      {sheet.isPending ? (
        <SkeletonRows rows={8} label="Loading the count sheet" />
      ) : sheet.isError ? (
        <ErrorState error={sheet.error} onRetry={() => sheet.refetch()} />
      ) : (
        <CountSheetView sheet={sheet.data} canWrite={can(work.role, 'counts.write')} />
      )}
    </div>
  );
}
