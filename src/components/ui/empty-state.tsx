import type { ReactNode } from 'react';

/** An empty list: what is missing and the next thing to do about it. */
export function EmptyState({ title, next, action }: { title: string; next: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-rule bg-card px-6 py-10 text-center">
      <p className="font-medium text-ink">{title}</p>
      <p className="mx-auto mt-1 max-w-prose text-muted">{next}</p>
      {action && <div className="mt-4 flex justify-center">{action}</div>}
    </div>
  );
}
