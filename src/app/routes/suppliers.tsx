import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { QueryView } from '../../components/ui/query-view';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useContractQuery } from '../../lib/contract';
import { can } from '../../shared/capabilities';
import { listSuppliers } from '../../shared/contract/suppliers';
import { SuppliersTable } from '../../features/suppliers/components/suppliers-table';

export function SuppliersRoute() {
  const me = useMe();
  const suppliers = useContractQuery(listSuppliers);
  const currency = me.data?.business.currency ?? 'GBP';
  const canEdit = can(me.data?.user.role, 'costs.write');
  const add = canEdit ? <ButtonLink to={paths.newSupplier.href()}>Add a supplier</ButtonLink> : undefined;
  return (
    <div className="flex max-w-6xl flex-col gap-6">
      <PageHeader title="Suppliers" description="Who you buy from, where their orders go, their minimum, the days they deliver and how they are paid." action={add} />
      <QueryView
        query={suppliers}
        loading="Loading the suppliers"
        empty={{
          when: (d) => d.suppliers.length === 0,
          state: <EmptyState title="No suppliers yet" next="Add the dairy, roaster or wholesaler you order from, with the e-mail address their orders go to." action={add} />,
        }}
      >
        {(d) => <SuppliersTable suppliers={d.suppliers} currency={currency} />}
      </QueryView>
    </div>
  );
}
