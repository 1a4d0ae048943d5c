import { formatDate } from '../../../lib/format';
import type { TimelineEvent } from '../api/types';

/** Every change to the order, oldest first, with who made it and when. */
export function OrderTimeline({ events }: { events: TimelineEvent[] }) {
  if (events.length === 0) return <p className="text-muted">Nothing has happened to this order yet.</p>;
  return (
    <ol className="relative flex flex-col gap-4 border-l-2 border-rule pl-5" aria-label="What happened to this order">
      {events.map((e) => (
        <li key={e.id} data-kind={e.kind} className="relative">
          <span aria-hidden="true" className="absolute -left-[1.7rem] top-1.5 h-3 w-3 rounded-full border-2 border-card bg-slate" />
          <p className="text-ink">{e.message}</p>
          <p className="text-sm text-muted">
            <time dateTime={e.at}>{formatDate(e.at, { withTime: true })}</time>
            {e.actor ? ` · ${e.actor}` : ''}
          </p>
        </li>
      ))}
    </ol>
  );
}
