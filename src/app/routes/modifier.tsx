import { useParams } from 'react-router-dom';
import { Button, ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { can } from '../../shared/capabilities';
import { useMe } from '../../features/auth/api/get-me';
import { useIngredients, useModifier, usePreparations, usePricingPolicy, useSizes } from '../../features/costing/api/queries';
import { ModifierEditor } from '../../features/costing/components/modifier-editor';

/** A new modifier (/modifiers/new) or an existing one (/modifiers/:modifierId). */
export function ModifierRoute() {
  const { modifierId } = useParams();
  const me = useMe();
  const modifier = useModifier(modifierId);
  const sizes = useSizes();
  const ingredients = useIngredients();
  const preparations = usePreparations();
  const pricing = usePricingPolicy();
  const canEdit = can(me.data?.user.role, 'costs.write');
  const detail = modifier.data?.modifier;
  const header = (
    <PageHeader
      title={modifierId ? (detail?.name ?? 'Modifier') : 'New modifier'}
      description="What the add-on or swap puts into (or takes out of) each cup size, and its upcharge on the menu."
      action={canEdit && (!modifierId || detail) ? <Button type="submit" form="modifier-form">Save modifier</Button> : undefined}
    />
  );
  const failed = [sizes, ingredients, preparations, pricing, ...(modifierId ? [modifier] : [])].find((q) => q.isError);
  if (failed) return <div className="max-w-6xl">{header}<ErrorState error={failed.error} onRetry={() => failed.refetch()} /></div>;
  if (!sizes.data || !ingredients.data || !preparations.data || !pricing.data || (modifierId && !detail))
    return <div className="max-w-6xl">{header}<SkeletonRows rows={8} label="Loading the modifier" /></div>;
  if (sizes.data.sizes.length === 0)
    return (
      <div className="max-w-6xl">
        {header}
        <EmptyState title="No cup sizes yet" next="Set the cup sizes you serve first; each modifier is costed per size." action={<ButtonLink to={paths.cupSizes.href()}>Set cup sizes</ButtonLink>} />
      </div>
    );
  return (
    <div className="max-w-[96rem]">
      {header}
      <ModifierEditor
        key={detail?.id ?? 'new'}
        modifier={detail}
        sizes={sizes.data.sizes}
        ingredients={ingredients.data.ingredients}
        preparations={preparations.data.preparations}
        pricing={pricing.data}
        canEdit={canEdit}
      />
    </div>
  );
}
