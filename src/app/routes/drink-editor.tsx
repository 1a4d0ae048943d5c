import { useParams } from 'react-router-dom';
import { Button, ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { can } from '../../shared/capabilities';
import { useMe } from '../../features/auth/api/get-me';
import { useDrink, useDrinks, useIngredients, usePreparations, usePricingPolicy, useSizes } from '../../features/costing/api/queries';
import { DrinkEditor } from '../../features/costing/components/drink-editor';

/** A new drink (/drinks/new) or an existing one (/drinks/:drinkId). */
export function DrinkEditorRoute() {
  const { drinkId } = useParams();
  const me = useMe();
  const drink = useDrink(drinkId);
  const sizes = useSizes();
  const ingredients = useIngredients();
  const preparations = usePreparations();
  const pricing = usePricingPolicy();
  const drinks = useDrinks();
  const canEdit = can(me.data?.user.role, 'costs.write');
  const title = drinkId ? (drink.data?.drink.name ?? 'Drink') : 'New drink';
  const header = (
    <PageHeader
      title={title}
      description="Build the drink for each cup size. The cost per cup, the suggested price and the margin follow as you type."
      action={
        canEdit && (!drinkId || drink.data) ? (
          <Button type="submit" form="drink-form">
            Save drink
          </Button>
        ) : undefined
      }
    />
  );
  const queries = [sizes, ingredients, preparations, pricing, ...(drinkId ? [drink] : [])];
  const failed = queries.find((q) => q.isError);
  if (failed) return <div className="max-w-6xl">{header}<ErrorState error={failed.error} onRetry={() => failed.refetch()} /></div>;
  if (!sizes.data || !ingredients.data || !preparations.data || !pricing.data || (drinkId && !drink.data))
    return <div className="max-w-6xl">{header}<SkeletonRows rows={8} label="Loading the drink" /></div>;
  if (sizes.data.sizes.length === 0)
    return (
      <div className="max-w-6xl">
        {header}
        <EmptyState title="No cup sizes yet" next="Set the cup sizes you serve first; each drink is built and priced per size." action={<ButtonLink to={paths.cupSizes.href()}>Set cup sizes</ButtonLink>} />
      </div>
    );
  const categories = [...new Set([...(drinks.data?.drinks.map((d) => d.category) ?? []), ...pricing.data.overrides.map((o) => o.category)])].sort();
  return (
    <div className="max-w-[96rem]">
      {header}
      <DrinkEditor
        key={drink.data?.drink.id ?? 'new'}
        drink={drink.data?.drink}
        sizes={sizes.data.sizes}
        ingredients={ingredients.data.ingredients}
        preparations={preparations.data.preparations}
        pricing={pricing.data}
        categories={categories}
        canEdit={canEdit}
      />
    </div>
  );
}
