import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useIngredients } from '../../features/costing/api/queries';
import { IngredientsTable } from '../../features/costing/components/ingredients-table';

export function IngredientsRoute() {
  const me = useMe();
  const ingredients = useIngredients();
  const add = <ButtonLink to={paths.newIngredient.href()}>Add an ingredient</ButtonLink>;
  return (
    <div className="flex max-w-7xl flex-col gap-2">
      <PageHeader title="Ingredients" description="What you buy, the pack that sets each one's cost, and what it costs per gram, millilitre or item and per measure." action={add} />
      {ingredients.isPending ? (
        <SkeletonRows rows={10} label="Loading the ingredients" />
      ) : ingredients.isError ? (
        <ErrorState error={ingredients.error} onRetry={() => ingredients.refetch()} />
      ) : ingredients.data.ingredients.length === 0 ? (
        <EmptyState title="No ingredients yet" next="Add what you buy (beans, milk, syrups, cups) with the pack and price from your supplier." action={add} />
      ) : (
        <IngredientsTable ingredients={ingredients.data.ingredients} currency={me.data?.business.currency ?? 'GBP'} />
      )}
    </div>
  );
}
