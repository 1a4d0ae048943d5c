import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button, TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { useStartCount } from '../api/counts';
import type { StockCount } from '../../../shared/contract/books';
import { localToday } from './dates';

/** Start a count for the site in the top bar, on a date (today unless changed), and open its sheet. */
export function StartCountForm({ siteId, siteName }: { siteId: string; siteName: string }) {
  const [countDate, setCountDate] = useState(localToday());
  const start = useStartCount();
  const navigate = useNavigate();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    start.mutate({ body: { siteId, countDate } }, { onSuccess: (r) => navigate(paths.stockCount.href(r.count.id)) });
  };
  const fieldError = isApiError(start.error) ? start.error.fields.countDate : undefined;
  return (
    <form onSubmit={submit} className="flex flex-col gap-4 rounded-lg border border-rule bg-card p-4 shadow-sm sm:flex-row sm:items-end">
      <Field label={`Count date at ${siteName}`} error={fieldError} className="sm:w-56">
        <Input type="date" required value={countDate} max={localToday()} onChange={(e) => setCountDate(e.target.value)} className="py-3 text-lg" />
      </Field>
      <Button type="submit" size="lg" busy={start.isPending}>
        Start count
      </Button>
      {start.error && !fieldError && <FormMessage>{isApiError(start.error) ? start.error.message : 'The count could not be started; try again.'}</FormMessage>}
    </form>
  );
}

/** The site's counts, newest first, with their status (and value, for roles that read costs); each opens its sheet. */
export function CountsList({ counts, currency }: { counts: StockCount[]; currency: string }) {
  if (counts.length === 0) return <EmptyState title="No stock counts yet" next="Start a count above: the sheet lists every pack this site stocks, by storage area." />;
  const sorted = [...counts].sort((a, b) => (a.countDate === b.countDate ? 0 : a.countDate < b.countDate ? 1 : -1));
  return (
    <ul aria-label="Stock counts" className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-card shadow-sm">
      {sorted.map((c) => (
        <li key={c.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-4">
          <div className="min-w-0">
            <TextLink to={paths.stockCount.href(c.id)} className="text-lg">
              {formatDate(c.countDate)}
            </TextLink>
            <p className="text-sm text-muted">
              {c.siteName} · {c.lineCount} {c.lineCount === 1 ? 'line' : 'lines'} counted{c.startedBy ? ` · started by ${c.startedBy}` : ''}
            </p>
          </div>
          <div className="flex items-center gap-4">
            {/* The value comes only to roles that read costs. */}
            {c.value !== undefined && <span className="text-right tabular-nums">{formatMoney(c.value, currency)}</span>}
            <StatusMark tone={c.status === 'finished' ? 'good' : 'attention'}>{c.status === 'finished' ? 'Finished' : 'In progress'}</StatusMark>
          </div>
        </li>
      ))}
    </ul>
  );
}
