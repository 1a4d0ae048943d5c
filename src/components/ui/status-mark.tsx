import type { ReactNode } from 'react';
import { cx } from './cx';

export type Tone = 'neutral' | 'good' | 'attention' | 'bad' | 'info';

// Each tone pairs a colour with a shape so meaning never rests on colour alone;
// the text label is always shown too.
const tones: Record<Tone, { box: string; mark: string }> = {
  neutral: { box: 'border-rule bg-paper text-ink', mark: '•' },
  good: { box: 'border-olive/40 bg-olive/10 text-olive', mark: '✓' },
  attention: { box: 'border-butter bg-butter/25 text-ink', mark: '!' },
  bad: { box: 'border-rose/40 bg-rose/10 text-rose', mark: '✕' },
  info: { box: 'border-slate/40 bg-slate/10 text-slate', mark: 'i' },
};

/** A small labelled status: the words carry the meaning, colour and mark back them up. */
export function StatusMark({ tone = 'neutral', children }: { tone?: Tone; children: ReactNode }) {
  const t = tones[tone];
  return (
    <span className={cx('inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs font-medium print:border-ink print:text-ink', t.box)}>
      <span aria-hidden="true">{t.mark}</span>
      {children}
    </span>
  );
}

/** A neutral label, e.g. a role. */
export function Badge({ children }: { children: ReactNode }) {
  return <span className="inline-flex items-center rounded border border-rule bg-paper px-2 py-0.5 text-xs font-medium text-ink">{children}</span>;
}
