import { useParams } from 'react-router-dom';
import { TextLink } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useContractQuery } from '../../lib/contract';
import { can } from '../../shared/capabilities';
import { getSupplier } from '../../shared/contract/suppliers';
import { SupplierForm } from '../../features/suppliers/components/supplier-form';

/** Add a supplier (/suppliers/new) or edit one (/suppliers/:supplierId). */
export function SupplierRoute() {
  const { supplierId } = useParams();
  const me = useMe();
  const supplier = useContractQuery(getSupplier, { params: { id: supplierId ?? '' } }, { enabled: Boolean(supplierId) });
  const currency = me.data?.business.currency ?? 'GBP';
  const canEdit = can(me.data?.user.role, 'costs.write');
  const title = supplierId ? (supplier.data?.supplier.name ?? 'Supplier') : 'Add a supplier';
  const header = (
    <>
      <p className="mb-2 text-sm">
        <TextLink to={paths.suppliers.href()}>All suppliers</TextLink>
      </p>
      <PageHeader
        title={title}
        description="Their details, where orders are e-mailed, and the terms the suggested order and the order editor work with."
        action={supplierId && canEdit ? <TextLink to={paths.stock.href(supplierId)}>See what to order from them</TextLink> : undefined}
      />
    </>
  );
  if (supplierId && supplier.isError) return <div className="max-w-4xl">{header}<ErrorState error={supplier.error} onRetry={() => supplier.refetch()} /></div>;
  if (supplierId && !supplier.data) return <div className="max-w-4xl">{header}<SkeletonRows rows={6} label="Loading the supplier" /></div>;
  return (
    <div className="max-w-4xl">
      {header}
      <SupplierForm key={supplier.data?.supplier.id ?? 'new'} supplier={supplier.data?.supplier} currency={currency} canEdit={canEdit} />
    </div>
  );
}
