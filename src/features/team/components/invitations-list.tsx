import { useCallback, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, Td, Th, THead, useSortedRows } from '../../../components/ui/table';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABELS as roleLabels } from '../../../shared/capabilities';
import { formatDate } from '../../../lib/format';
import type { Invitation } from '../../../shared/contract/team';
import { useRevokeInvitation } from '../api/revoke-invitation';

type SortKey = 'email' | 'role' | 'expiresAt';

/** Invitations not yet accepted, soonest to lapse first; a short list, so sortable but not filtered. */
export function InvitationsList({ invitations }: { invitations: Invitation[] }) {
  const revoke = useRevokeInvitation();
  const { notify } = useToast();
  const [revoking, setRevoking] = useState<Invitation | null>(null);
  // Read the clock once per visit; an invitation that lapses while the page is open shows on the next visit.
  const [now] = useState(() => Date.now());
  const value = useCallback((inv: Invitation, key: SortKey) => (key === 'role' ? roleLabels[inv.role] : inv[key]), []);
  const { sorted, sort, onSort } = useSortedRows<Invitation, SortKey>(invitations, { key: 'expiresAt', direction: 'asc' }, value);

  if (invitations.length === 0)
    return <EmptyState title="No invitations waiting" next="Invite someone with the form above; their invitation shows here until they join." />;

  return (
    <>
      <Table caption="Invitations not yet accepted">
        <THead>
          <tr>
            <SortHeader label="E-mail" sortKey="email" sort={sort} onSort={onSort} />
            <SortHeader label="Role" sortKey="role" sort={sort} onSort={onSort} />
            <SortHeader label="Link valid until" sortKey="expiresAt" sort={sort} onSort={onSort} />
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </THead>
        <tbody>
          {sorted.map((inv) => {
            const expired = new Date(inv.expiresAt).getTime() < now;
            return (
              <tr key={inv.id}>
                <Td className="break-all">{inv.email}</Td>
                <Td>{roleLabels[inv.role]}</Td>
                <Td className="tabular-nums">
                  {expired ? <StatusMark tone="attention">Expired</StatusMark> : formatDate(inv.expiresAt, { withTime: true })}
                </Td>
                <Td className="text-right">
                  <Button variant="secondary" size="sm" onClick={() => setRevoking(inv)}>
                    Withdraw<span className="sr-only"> the invitation to {inv.email}</span>
                  </Button>
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
      <ConfirmDialog
        open={revoking !== null}
        title="Withdraw this invitation?"
        consequence={<p>The link sent to {revoking?.email} will stop working. You can invite them again later.</p>}
        confirmLabel="Withdraw the invitation"
        busy={revoke.isPending}
        error={revoke.isError ? (isApiError(revoke.error) ? revoke.error.message : 'That did not work. Try again.') : undefined}
        onCancel={() => {
          revoke.reset();
          setRevoking(null);
        }}
        onConfirm={() => {
          if (!revoking) return;
          revoke.mutate({ params: { id: revoking.id } }, {
            onSuccess: () => {
              setRevoking(null);
              notify('Invitation withdrawn.');
            },
          });
        }}
      />
    </>
  );
}
