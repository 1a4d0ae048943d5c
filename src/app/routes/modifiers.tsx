import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useModifiers, useSizes } from '../../features/costing/api/queries';
import { ModifiersTable } from '../../features/costing/components/modifiers-table';

export function ModifiersRoute() {
  const me = useMe();
  const modifiers = useModifiers();
  const sizes = useSizes();
  const currency = me.data?.business.currency ?? 'GBP';
  const add = <ButtonLink to={paths.newModifier.href()}>Add a modifier</ButtonLink>;
  const failed = [modifiers, sizes].find((q) => q.isError);
  return (
    <div className="flex max-w-6xl flex-col gap-6">
      <PageHeader
        title="Modifiers"
        description="Add-ons and swaps (an extra shot, a pump of syrup, plant milk for dairy): what each adds to the cost of a cup in each size, and the upcharge that keeps your margin."
        action={add}
      />
      {failed ? (
        <ErrorState error={failed.error} onRetry={() => failed.refetch()} />
      ) : !modifiers.data || !sizes.data ? (
        <SkeletonRows rows={5} label="Loading the modifiers" />
      ) : modifiers.data.modifiers.length === 0 ? (
        <EmptyState
          title="No modifiers yet"
          next="Add your first add-on or swap: what it adds (or takes out) for each cup size, then its upcharge on the menu."
          action={add}
        />
      ) : (
        <ModifiersTable modifiers={modifiers.data.modifiers} sizes={sizes.data.sizes} currency={currency} />
      )}
    </div>
  );
}
