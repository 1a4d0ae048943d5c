import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMenuCosting } from '../../features/costing/api/queries';
import { MenuCostingView } from '../../features/costing/components/menu-costing';

export function MenuCostingRoute() {
  const menu = useMenuCosting();
  return (
    <div className="flex max-w-7xl flex-col gap-2">
      <PageHeader
        title="Menu costing"
        description="What every drink costs to make in each cup size, its margin at today's menu price, and the price that would meet your target."
        action={<ButtonLink to={paths.pricing.href()} variant="secondary">Pricing policy</ButtonLink>}
      />
      {menu.isPending ? (
        <SkeletonRows rows={10} label="Costing the menu" />
      ) : menu.isError ? (
        <ErrorState error={menu.error} onRetry={() => menu.refetch()} />
      ) : menu.data.drinks.length === 0 ? (
        <EmptyState title="Nothing to cost yet" next="Add drinks and their builds first; each appears here costed per cup size." action={<ButtonLink to={paths.newDrink.href()}>Add a drink</ButtonLink>} />
      ) : (
        <MenuCostingView data={menu.data} />
      )}
    </div>
  );
}
