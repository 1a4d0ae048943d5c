import { useParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { can } from '../../shared/capabilities';
import { useMe } from '../../features/auth/api/get-me';
import { useIngredients, usePreparation, usePreparations, usePricingPolicy } from '../../features/costing/api/queries';
import { PreparationEditor } from '../../features/costing/components/preparation-editor';

/** A new preparation (/preparations/new) or an existing one. */
export function PreparationRoute() {
  const { preparationId } = useParams();
  const me = useMe();
  const preparation = usePreparation(preparationId ?? '');
  const ingredients = useIngredients();
  const preparations = usePreparations();
  const pricing = usePricingPolicy();
  const editing = Boolean(preparationId);
  const canEdit = can(me.data?.user.role, 'costs.write');
  const detail = preparation.data?.preparation;
  const header = (
    <PageHeader
      title={editing ? (detail?.name ?? 'Preparation') : 'New preparation'}
      description="Its lines and what one batch yields; the cost per batch and per unit follow as you type."
      action={canEdit && (!editing || detail) ? <Button type="submit" form="preparation-form">Save preparation</Button> : undefined}
    />
  );
  const failed = [ingredients, preparations, pricing, ...(editing ? [preparation] : [])].find((q) => q.isError);
  if (failed) return <div className="max-w-6xl">{header}<ErrorState error={failed.error} onRetry={() => failed.refetch()} /></div>;
  if (!ingredients.data || !preparations.data || !pricing.data || (editing && !detail))
    return <div className="max-w-6xl">{header}<SkeletonRows rows={6} label="Loading the preparation" /></div>;
  return (
    <div className="max-w-6xl">
      {header}
      <PreparationEditor key={detail?.id ?? 'new'} preparation={detail} ingredients={ingredients.data.ingredients} preparations={preparations.data.preparations} pricing={pricing.data} canEdit={canEdit} />
    </div>
  );
}
