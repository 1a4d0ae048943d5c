import type { ReactNode } from 'react';
import { FormMessage } from '../../../components/ui/form-message';
import { isApiError } from '../../../lib/api-client';
import { formatQuantity } from '../../../lib/format';

/** The cup sizes side by side, scrolling sideways when they do not fit. */
export function SizeColumns({ count, children }: { count: number; children: ReactNode }) {
  // Relative, so the screen-reader-only words in the columns (absolutely placed) are held in the
  // scroller too: without it they stuck out past a phone's edge and the whole page scrolled sideways.
  return (
    <div className="relative overflow-x-auto pb-2">
      <div className="grid gap-4" style={{ gridTemplateColumns: `repeat(${count}, minmax(17rem, 1fr))` }}>
        {children}
      </div>
    </div>
  );
}

/** A cup size's name with its volume beside it. */
export function SizeHeading({ id, name, volumeMl }: { id: string; name: string; volumeMl: string }) {
  return (
    <h3 id={id} className="text-lg font-bold">
      {name} <span className="text-sm font-normal text-muted tabular-nums">{formatQuantity(volumeMl, 'ml')}</span>
    </h3>
  );
}

/** Why the preview route refused the build: its first field message, else the error's own. */
export function PreviewError({ error }: { error: unknown }) {
  return <FormMessage>The cost could not be worked out: {Object.values(isApiError(error) ? error.fields : {})[0] ?? (error as Error).message}</FormMessage>;
}
