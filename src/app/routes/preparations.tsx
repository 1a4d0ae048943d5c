import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { usePreparations } from '../../features/costing/api/queries';
import { PreparationsTable } from '../../features/costing/components/preparations-table';

export function PreparationsRoute() {
  const me = useMe();
  const preparations = usePreparations();
  const add = <ButtonLink to={paths.newPreparation.href()}>Add a preparation</ButtonLink>;
  return (
    <div className="flex max-w-6xl flex-col gap-2">
      <PageHeader title="Preparations" description="What you make in house in batches (syrups, concentrates, cold brew) and what each batch and each millilitre costs." action={add} />
      {preparations.isPending ? (
        <SkeletonRows rows={4} label="Loading the preparations" />
      ) : preparations.isError ? (
        <ErrorState error={preparations.error} onRetry={() => preparations.refetch()} />
      ) : preparations.data.preparations.length === 0 ? (
        <EmptyState title="No preparations yet" next="Add what you make in batches, such as a house syrup: its lines and what one batch yields." action={add} />
      ) : (
        <PreparationsTable preparations={preparations.data.preparations} currency={me.data?.business.currency ?? 'GBP'} />
      )}
    </div>
  );
}
