import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import type { Role } from '../../lib/api-types';
import { useWaste } from '../../features/books/api/waste';
import { localMonth } from '../../features/books/components/dates';
import { WasteForm, type WasteChoice } from '../../features/books/components/waste-form';
import { WasteList } from '../../features/books/components/waste-list';
import { ingredientsQueryOptions } from '../../features/costing/api/get-ingredients';
import { menuCostingQueryOptions } from '../../features/costing/api/get-menu-costing';
import { preparationsQueryOptions } from '../../features/costing/api/get-preparations';
import { useWorkSite } from './work-site';

// Mirrors the server's capabilities: 'waste.write' and 'costs.read' (the item lists come from the costing API).
const WASTE_WRITERS: readonly Role[] = ['owner', 'barista', 'bookkeeper'];
const COST_READERS: readonly Role[] = ['owner', 'manager', 'bookkeeper'];

/** Ingredients, preparations and drinks by cup size, from the costing API, as waste choices. */
function useWasteChoices(enabled: boolean) {
  const ingredients = useQuery({ ...ingredientsQueryOptions(), enabled });
  const preparations = useQuery({ ...preparationsQueryOptions(), enabled });
  const menu = useQuery({ ...menuCostingQueryOptions(), enabled });
  const choices = useMemo<WasteChoice[]>(
    () => [
      ...(ingredients.data?.ingredients ?? []).map((i) => ({ kind: 'ingredient' as const, id: i.id, name: i.name, baseUnit: i.baseUnit })),
      ...(preparations.data?.preparations ?? []).map((p) => ({ kind: 'preparation' as const, id: p.id, name: p.name, baseUnit: p.baseUnit })),
      ...(menu.data?.drinks ?? []).flatMap((d) => d.sizes.map((s) => ({ kind: 'drinkSize' as const, id: s.drinkSizeId, name: `${d.name} (${s.name})` }))),
    ],
    [ingredients.data, preparations.data, menu.data],
  );
  const first = [ingredients, preparations, menu].find((q) => q.isError);
  return { choices, pending: enabled && (ingredients.isPending || preparations.isPending || menu.isPending), error: enabled ? first?.error : undefined };
}

export function WasteRoute() {
  const work = useWorkSite();
  const month = localMonth();
  const waste = useWaste(work.site?.id, month);
  const canWrite = work.role !== null && WASTE_WRITERS.includes(work.role);
  const canList = work.role !== null && COST_READERS.includes(work.role);
  const options = useWasteChoices(canWrite && canList);
  return (
    <div className="flex max-w-4xl flex-col gap-6 text-lg">
      <PageHeader title="Waste" description="Record what was thrown away and why. It is valued at cost on the day and shows in the month's figures." />
      {work.pending ? (
        <SkeletonRows rows={3} label="Loading your site" />
      ) : !work.site ? (
        <EmptyState title="No site yet" next="An owner adds the business's sites in Settings; waste is kept per site." />
      ) : canWrite && !canList ? (
        <p role="note" className="rounded-md border border-butter bg-butter/20 px-4 py-3 text-base">
          The list of items to record waste against is not open to your role yet. Ask an owner or the bookkeeper to record it for now.
        </p>
      ) : canWrite ? (
        options.pending ? (
          <SkeletonRows rows={4} label="Loading items" />
        ) : options.error ? (
          <ErrorState error={options.error} />
        ) : (
          <WasteForm siteId={work.site.id} choices={options.choices} entries={waste.data?.entries} currency={waste.data?.currency} />
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
