import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useDrinks } from '../../features/costing/api/queries';
import { DrinksTable } from '../../features/costing/components/drinks-table';

export function DrinksRoute() {
  const me = useMe();
  const drinks = useDrinks();
  const currency = me.data?.business.currency ?? 'GBP';
  return (
    <div className="flex max-w-6xl flex-col gap-6">
      <PageHeader
        title="Drinks"
        description="Each drink on the menu, the cup sizes it comes in and its menu prices. Open one to edit its builds and see what each cup costs."
        action={<ButtonLink to={paths.newDrink.href()}>Add a drink</ButtonLink>}
      />
      {drinks.isPending ? (
        <SkeletonRows rows={6} label="Loading the drinks" />
      ) : drinks.isError ? (
        <ErrorState error={drinks.error} onRetry={() => drinks.refetch()} />
      ) : drinks.data.drinks.length === 0 ? (
        <EmptyState
          title="No drinks yet"
          next="Add your first drink: its build for each cup size, then its menu price. The cost per cup is worked out as you type."
          action={<ButtonLink to={paths.newDrink.href()}>Add a drink</ButtonLink>}
        />
      ) : (
        <DrinksTable drinks={drinks.data.drinks} currency={currency} />
      )}
    </div>
  );
}
