import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney } from '../../../lib/format';
import { useFinishCount } from '../api/counts';
import type { CountSheet } from '../../../shared/contract/books';
import { CountLine } from './count-line';

/** The count sheet by storage area, each pack saving itself, and the finish step with its confirmation. */
export function CountSheetView({ sheet, canWrite }: { sheet: CountSheet; canWrite: boolean }) {
  const { count, currency, areas } = sheet;
  const finished = count.status === 'finished';
  const [asking, setAsking] = useState(false);
  const finish = useFinishCount();
  const total = areas.reduce((n, a) => n + a.items.length, 0);
  const counted = areas.reduce((n, a) => n + a.items.filter((i) => i.packs !== null).length, 0);

  if (total === 0)
    return <EmptyState title="No packs to count" next="Add the packs you buy to your ingredients, and list what this site stocks; they appear here by storage area." />;

  return (
    <div className="flex flex-col gap-5">
      {finished && (
        <p role="status" className="rounded-md border border-olive/40 bg-card px-4 py-3 text-ink">
          Finished {count.finishedAt ? formatDate(count.finishedAt, { withTime: true }) : ''}
          {count.finishedBy ? ` by ${count.finishedBy}` : ''}.
          {/* The value comes only to roles that read costs. */}
          {count.value !== undefined && ` Stock valued at ${formatMoney(count.value, currency)}.`}
        </p>
      )}
      <nav aria-label="Storage areas" className="flex flex-wrap gap-2">
        {areas.map((a, i) => (
          <a key={a.id ?? 'none'} href={`#area-${i}`} className="rounded-full border border-rule bg-card px-4 py-2 text-base font-medium text-ink underline-offset-2 hover:underline">
            {a.name} <span className="text-muted">({a.items.length})</span>
          </a>
        ))}
      </nav>
      {areas.map((a, i) => (
        <section key={a.id ?? 'none'} id={`area-${i}`} aria-labelledby={`area-${i}-title`} className="scroll-mt-4 rounded-lg border border-rule bg-card px-4 py-3 shadow-sm">
          <h2 id={`area-${i}-title`} className="text-xl font-bold text-ink">
            {a.name}
          </h2>
          <ul>
            {a.items.map((item) => (
              <CountLine key={item.packId} countId={count.id} item={item} currency={currency} readOnly={finished || !canWrite} />
            ))}
          </ul>
        </section>
      ))}
      {!finished && canWrite && (
        <div className="sticky bottom-0 -mx-4 flex flex-wrap items-center justify-between gap-3 border-t border-rule bg-paper/95 px-4 py-3">
          <p className="text-base text-ink">
            <span className="font-bold tabular-nums">{counted}</span> of <span className="tabular-nums">{total}</span> packs counted
          </p>
          <Button size="lg" onClick={() => setAsking(true)}>
            Finish count
          </Button>
        </div>
      )}
      <ConfirmDialog
        open={asking}
        title="Finish this count?"
        consequence={
          <>
            <p>
              The count for {formatDate(count.countDate)} at {count.siteName} will be locked: no more changes to its lines.
            </p>
            {counted < total && (
              <p className="mt-2 font-medium">
                {total - counted} of {total} packs have no count yet; they will be left out of the stock value.
              </p>
            )}
          </>
        }
        confirmLabel="Finish count"
        busy={finish.isPending}
        error={finish.error ? (isApiError(finish.error) ? finish.error.message : 'Not finished: try again.') : undefined}
        onCancel={() => setAsking(false)}
        onConfirm={() => finish.mutate({ params: { id: count.id } }, { onSuccess: () => setAsking(false) })}
      />
    </div>
  );
}
