import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { useWaste, useWasteChoices } from '../../features/books/api/waste';
import { localMonth } from '../../features/books/components/dates';
import { WasteForm } from '../../features/books/components/waste-form';
import { WasteList } from '../../features/books/components/waste-list';
import { can } from '../../shared/capabilities';
import { useWorkSite } from './work-site';


export function WasteRoute() {
  const work = useWorkSite();
  const month = localMonth();
  const waste = useWaste(work.site?.id, month);
  const canWrite = can(work.role, 'waste.write');
  const choices = useWasteChoices(canWrite);
  return (
    <div className="flex max-w-4xl flex-col gap-6 text-lg">
      <PageHeader title="Waste" description="Record what was thrown away and why. It is valued at cost on the day and shows in the month's figures." />
      {work.pending ? (
        <SkeletonRows rows={3} label="Loading your site" />
      ) : !work.site ? (
        <EmptyState title="No site yet" next="An owner adds the business's sites in Settings; waste is kept per site." />
      ) : canWrite ? (
        choices.isPending ? (
          <SkeletonRows rows={4} label="Loading items" />
        ) : choices.isError ? (
          <ErrorState error={choices.error} onRetry={() => choices.refetch()} />
        ) : (
          <WasteForm siteId={work.site.id} choices={choices.data.choices} entries={waste.data?.entries} currency={waste.data?.currency} />
        )
      ) : null}
      <section aria-labelledby="waste-month" className="flex flex-col gap-3">
        <h2 id="waste-month" className="text-xl font-bold">
          This month at {work.site?.name ?? 'this site'}
        </h2>
        {waste.isPending ? (
          <SkeletonRows rows={4} label="Loading this month's waste" />
        ) : waste.isError ? (
          <ErrorState error={waste.error} onRetry={() => waste.refetch()} />
        ) : (
          <WasteList entries={waste.data.entries} total={waste.data.total} currency={waste.data.currency} canDelete={canWrite} />
        )}
      </section>
    </div>
  );
}
