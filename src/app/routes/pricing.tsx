import { CardSection } from '../../components/ui/card';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { can } from '../../shared/capabilities';
import { useMe } from '../../features/auth/api/get-me';
import { usePricingPolicy, useSizes } from '../../features/costing/api/queries';
import { CupSizesEditor } from '../../features/costing/components/cup-sizes-editor';
import { PricingPolicyForm } from '../../features/costing/components/pricing-policy-form';

/** Cup sizes and the pricing policy: what every drink is built and priced against. */
export function PricingRoute() {
  const me = useMe();
  const sizes = useSizes();
  const policy = usePricingPolicy();
  const canEdit = can(me.data?.user.role, 'costs.write');
  return (
    <div className="flex max-w-5xl flex-col gap-8">
      <PageHeader title="Cup sizes and pricing" description="The cups you serve, and the margin, tax and rounding that suggested menu prices follow." />
      <div id="cup-sizes">
        <CardSection title="Cup sizes">
          {sizes.isPending ? <SkeletonRows rows={3} label="Loading the cup sizes" /> : sizes.isError ? <ErrorState error={sizes.error} onRetry={() => sizes.refetch()} /> : <CupSizesEditor sizes={sizes.data.sizes} canEdit={canEdit} />}
        </CardSection>
      </div>
      <CardSection title="Pricing policy">
        {policy.isPending ? <SkeletonRows rows={3} label="Loading the pricing policy" /> : policy.isError ? <ErrorState error={policy.error} onRetry={() => policy.refetch()} /> : <PricingPolicyForm data={policy.data} canEdit={canEdit} />}
      </CardSection>
    </div>
  );
}
