import { monthOf } from '../../src/shared/calendar';
import type { Period } from '../../src/shared/contract/books';
import type { PeriodEventRow, PeriodRow } from './periods.repo';

export function presentPeriods(periods: readonly PeriodRow[], events: readonly PeriodEventRow[]): Period[] {
  return periods.map((p) => ({
    month: monthOf(p.month),
    status: p.status,
    closedAt: p.closed_at ? new Date(p.closed_at).toISOString() : null,
    closedBy: p.status === 'closed' ? p.closed_by : null,
    events: events.filter((e) => e.period_id === p.id).map((e) => ({ action: e.action, at: new Date(e.at).toISOString(), by: e.by, reason: e.reason })),
  }));
}
