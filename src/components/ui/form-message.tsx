import type { ReactNode } from 'react';

/** A message above a form about the whole form (not one field). */
export function FormMessage({ tone = 'error', children }: { tone?: 'error' | 'info'; children: ReactNode }) {
  if (!children) return null;
  return tone === 'error' ? (
    <p role="alert" className="rounded-md border border-rose/40 bg-rose/5 px-3 py-2 text-sm font-medium text-rose">
      {children}
    </p>
  ) : (
    <p role="status" className="rounded-md border border-slate/30 bg-slate/5 px-3 py-2 text-sm text-ink">
      {children}
    </p>
  );
}
