import { useParams } from 'react-router-dom';
import { TextLink } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { usePriceHistory } from '../../features/repricing/api/get-price-history';
import { PriceHistoryTable } from '../../features/repricing/components/price-history-table';

export function PriceHistoryRoute() {
  const { drinkId = '' } = useParams();
  const q = usePriceHistory(drinkId);
  return (
    <div className="flex max-w-5xl flex-col gap-6">
      <PageHeader
        title={q.data ? `Price history: ${q.data.drink.name}` : 'Price history'}
        description="Every menu price this drink has had, per size: when it took effect, who changed it and why."
        action={<TextLink to={paths.repricing.href()}>Back to repricing</TextLink>}
      />
      {q.isPending ? <SkeletonRows rows={4} label="Loading the price history" /> : q.isError ? <ErrorState error={q.error} onRetry={() => q.refetch()} /> : <PriceHistoryTable data={q.data} />}
    </div>
  );
}
