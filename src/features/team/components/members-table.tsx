import { useCallback, useState } from 'react';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Button } from '../../../components/ui/button';
import { Select } from '../../../components/ui/input';
import { SortHeader, Table, Td, THead, useSortedRows } from '../../../components/ui/table';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABELS as roleLabels, ROLES as roles, type Role } from '../../../shared/capabilities';
import { useChangeRole } from '../api/change-role';
import type { Member } from '../../../shared/contract/team';
import { useRemoveMember } from '../api/remove-member';

type SortKey = 'name' | 'email' | 'role';

function explainTeamError(err: unknown): string {
  if (isApiError(err) && err.code === 'last_owner') return 'The business needs at least one owner. Make someone else an owner first.';
  if (isApiError(err)) return err.message;
  return 'That did not work. Try again.';
}

export function MembersTable({ members, currentUserId }: { members: Member[]; currentUserId: string }) {
  const changeRole = useChangeRole();
  const remove = useRemoveMember();
  const { notify } = useToast();
  const [removing, setRemoving] = useState<Member | null>(null);
  const [rowError, setRowError] = useState<{ id: string; message: string } | null>(null);
  const value = useCallback((m: Member, key: SortKey) => (key === 'role' ? roleLabels[m.role] : m[key]), []);
  const { sorted, sort, onSort } = useSortedRows<Member, SortKey>(members, { key: 'name', direction: 'asc' }, value);

  const onRoleChange = (member: Member, role: Role) => {
    setRowError(null);
    changeRole.mutate(
      { params: { id: member.id }, body: { role } },
      {
        onSuccess: () => notify(`${member.name} is now ${roleLabels[role].toLowerCase()}.`),
        onError: (err) => setRowError({ id: member.id, message: explainTeamError(err) }),
      },
    );
  };

  return (
    <>
      <Table caption="People in the business">
        <THead>
          <tr>
            <SortHeader label="Name" sortKey="name" sort={sort} onSort={onSort} />
            <SortHeader label="E-mail" sortKey="email" sort={sort} onSort={onSort} />
            <SortHeader label="Role" sortKey="role" sort={sort} onSort={onSort} />
            <th scope="col" className="px-3 py-2">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </THead>
        <tbody>
          {sorted.map((m) => {
            const you = m.id === currentUserId;
            const selectId = `role-${m.id}`;
            const errorId = `role-error-${m.id}`;
            return (
              <tr key={m.id}>
                <Td>
                  <span className="font-medium">{m.name}</span>
                  {you && <span className="ml-2 text-muted">(you)</span>}
                </Td>
                <Td className="break-all">{m.email}</Td>
                <Td>
                  <label htmlFor={selectId} className="sr-only">
                    Role of {m.name}
                  </label>
                  <Select
                    id={selectId}
                    value={m.role}
                    className="min-w-36 py-1"
                    aria-describedby={rowError?.id === m.id ? errorId : undefined}
                    invalid={rowError?.id === m.id}
                    disabled={changeRole.isPending && changeRole.variables?.params.id === m.id}
                    onChange={(e) => onRoleChange(m, e.target.value as Role)}
                  >
                    {roles.map((r) => (
                      <option key={r} value={r}>
                        {roleLabels[r]}
                      </option>
                    ))}
                  </Select>
                  {rowError?.id === m.id && (
                    <p id={errorId} role="alert" className="mt-1 text-sm font-medium text-rose">
                      {rowError.message}
                    </p>
                  )}
                </Td>
                <Td className="text-right">
                  {!you && (
                    <Button variant="secondary" size="sm" onClick={() => setRemoving(m)}>
                      Remove<span className="sr-only"> {m.name}</span>
                    </Button>
                  )}
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
      <ConfirmDialog
        open={removing !== null}
        title={`Remove ${removing?.name ?? ''}?`}
        consequence={
          <p>
            {removing?.name}&apos;s account ({removing?.email}) will be deleted and they will lose access to this business straight away. To
            bring them back, send a new invitation.
          </p>
        }
        confirmLabel="Remove from the business"
        busy={remove.isPending}
        error={remove.isError ? explainTeamError(remove.error) : undefined}
        onCancel={() => {
          remove.reset();
          setRemoving(null);
        }}
        onConfirm={() => {
          if (!removing) return;
          const name = removing.name;
          remove.mutate({ params: { id: removing.id } }, {
            onSuccess: () => {
              setRemoving(null);
              notify(`${name} was removed.`);
            },
          });
        }}
      />
    </>
  );
}
