import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { StatusMark } from '../../../components/ui/status-mark';
import { formatDate } from '../../../lib/format';
import { can, type Role } from '../../../shared/capabilities';
import { usePeriodAction, usePeriods } from '../api/periods';

const monthLabel = (m: string) => new Date(`${m}-01T12:00:00Z`).toLocaleDateString(undefined, { month: 'long', year: 'numeric', timeZone: 'UTC' });

/** Whether the month is closed, who closed or reopened it and when, and the button to do it. */
export function MonthClose({ month, closed, role, ended }: { month: string; closed: boolean; role: Role | null; ended: boolean }) {
  const periods = usePeriods();
  const close = usePeriodAction('close');
  const reopen = usePeriodAction('reopen');
  const [asking, setAsking] = useState<'close' | 'reopen' | null>(null);
  const period = periods.data?.periods.find((p) => p.month === month);
  const canClose = can(role, 'periods.close');
  const canReopen = can(role, 'periods.reopen');
  const action = asking === 'close' ? close : reopen;
  return (
    <section aria-labelledby="month-close-heading" className="flex flex-col gap-2 rounded-lg border border-rule bg-card p-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="month-close-heading" className="font-bold">
          Month end: {monthLabel(month)} <StatusMark tone={closed ? 'info' : 'neutral'}>{closed ? 'closed' : 'open'}</StatusMark>
        </h2>
        {closed
          ? canReopen && <Button variant="secondary" onClick={() => setAsking('reopen')}>Reopen {monthLabel(month)}</Button>
          : canClose && ended && <Button onClick={() => setAsking('close')}>Close {monthLabel(month)}</Button>}
      </div>
      <p className="text-sm text-muted">
        {closed
          ? 'Its counts, deliveries, sales and waste are read-only and these figures stay as they were when it was closed.'
          : ended ? 'Once the counts, deliveries and till sales are in, close the month so its figures stay fixed.' : 'The month has not ended yet.'}
      </p>
      {period && period.events.length > 0 && (
        <ul className="text-sm">
          {period.events.map((e) => (
            <li key={e.at}>
              {e.action === 'close' ? 'Closed' : 'Reopened'} by {e.by ?? 'a former member'} on {formatDate(e.at, { withTime: true })}
              {e.reason ? ` — ${e.reason}` : ''}
            </li>
          ))}
        </ul>
      )}
      <ConfirmDialog
        open={asking !== null}
        title={asking === 'close' ? `Close ${monthLabel(month)}?` : `Reopen ${monthLabel(month)}?`}
        consequence={
          asking === 'close'
            ? 'Counts, deliveries, till sales and waste dated in the month can no longer be changed, and the figures are kept as they are now. Only an owner can reopen it.'
            : 'The month becomes editable again and its figures are worked out afresh from the stored records. The reopening is recorded with your name.'
        }
        confirmLabel={asking === 'close' ? 'Close the month' : 'Reopen the month'}
        busy={action.isPending}
        error={action.error ? action.error.message : undefined}
        onConfirm={() => action.mutate({ params: { month }, body: {} }, { onSuccess: () => setAsking(null) })}
        onCancel={() => setAsking(null)}
      />
    </section>
  );
}
