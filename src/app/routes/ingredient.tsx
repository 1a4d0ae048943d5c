import { useParams } from 'react-router-dom';
import { Button, TextLink } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { formatMoney } from '../../lib/format';
import { paths } from '../../lib/paths';
import { can } from '../../shared/capabilities';
import { useMe } from '../../features/auth/api/get-me';
import { useIngredient, useSuppliers } from '../../features/costing/api/queries';
import { IngredientForm } from '../../features/costing/components/ingredient-form';

/** A new ingredient (/ingredients/new) or an existing one. */
export function IngredientRoute() {
  const { ingredientId } = useParams();
  const me = useMe();
  const suppliers = useSuppliers();
  const ingredient = useIngredient(ingredientId ?? '');
  const editing = Boolean(ingredientId);
  const canEdit = can(me.data?.user.role, 'costs.write');
  const currency = me.data?.business.currency ?? 'GBP';
  const detail = ingredient.data?.ingredient;
  const header = (
    <PageHeader
      title={editing ? (detail?.name ?? 'Ingredient') : 'New ingredient'}
      description={
        detail?.unitCost ? (
          <>
            Costs <span className="font-medium tabular-nums text-ink">{formatMoney(detail.unitCost, currency, { detail: true })}</span> per {detail.baseUnit} after its yield.{' '}
            <TextLink to={paths.ingredients.href()}>All ingredients</TextLink>
          </>
        ) : (
          'Its packs and prices set what it costs per gram, millilitre or item.'
        )
      }
      action={canEdit && (!editing || detail) ? <Button type="submit" form="ingredient-form">Save ingredient</Button> : undefined}
    />
  );
  const failed = [suppliers, ...(editing ? [ingredient] : [])].find((q) => q.isError);
  if (failed) return <div className="max-w-6xl">{header}<ErrorState error={failed.error} onRetry={() => failed.refetch()} /></div>;
  if (!suppliers.data || (editing && !detail)) return <div className="max-w-6xl">{header}<SkeletonRows rows={8} label="Loading the ingredient" /></div>;
  return (
    <div className="max-w-6xl">
      {header}
      <IngredientForm key={detail?.id ?? 'new'} ingredient={detail} suppliers={suppliers.data.suppliers} currency={currency} canEdit={canEdit} />
    </div>
  );
}
