import { useCallback, useId, useMemo, useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Select } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, TableFilters, TableSearch, Td, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import { cx, focusRing } from '../../../components/ui/cx';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney, formatQuantity } from '../../../lib/format';
import { uploadTillFile, useAcceptImport, useDiscardImport, usePreviewImport } from '../api/sales-import';
import type { ColumnMapping, DateFormat, ImportPreview, UploadResult } from '../../../shared/contract/books';

type ImportError = ImportPreview['errors'][number];

const COLUMN_FIELDS = [
  { key: 'date', label: 'Date', required: true },
  { key: 'item', label: 'Item', required: true },
  { key: 'size', label: 'Size', required: false },
  { key: 'quantity', label: 'Quantity', required: true },
  { key: 'netSales', label: 'Net sales', required: true },
  { key: 'tax', label: 'Tax', required: false },
] as const;
type ColumnKey = (typeof COLUMN_FIELDS)[number]['key'];

const DATE_FORMATS: { value: DateFormat; label: string }[] = [
  { value: 'YYYY-MM-DD', label: '2025-03-31 (year first)' },
  { value: 'DD/MM/YYYY', label: '31/03/2025 (day first)' },
  { value: 'MM/DD/YYYY', label: '03/31/2025 (month first)' },
];

type Draft = Record<ColumnKey, string> & { dateFormat: DateFormat };

function draftFrom(upload: UploadResult): Draft {
  const c = upload.columns;
  return { date: c.date ?? '', item: c.item ?? '', size: c.size ?? '', quantity: c.quantity ?? '', netSales: c.netSales ?? '', tax: c.tax ?? '', dateFormat: c.dateFormat ?? 'YYYY-MM-DD' };
}

function mappingOf(d: Draft): ColumnMapping {
  return { date: d.date, item: d.item, size: d.size || null, quantity: d.quantity, netSales: d.netSales, tax: d.tax || null, dateFormat: d.dateFormat };
}

const itemKey = (i: { tillItem: string; tillSize: string }) => `${i.tillItem}\u0000${i.tillSize}`;

/** The upload with its progress bar. */
function UploadStep({ siteId, onUploaded }: { siteId: string; onUploaded: (r: UploadResult) => void }) {
  const input = useRef<HTMLInputElement>(null);
  const fileId = useId();
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const file = input.current?.files?.[0];
    if (!file) return setError('Choose the CSV file exported from the till.');
    setError(null);
    setProgress(0);
    try {
      onUploaded(await uploadTillFile(siteId, file, setProgress));
    } catch (err) {
      setError(isApiError(err) ? err.message : 'The upload failed; try again.');
    } finally {
      setProgress(null);
    }
  };
  const pct = progress === null ? 0 : Math.round(progress * 100);
  return (
    <form onSubmit={submit} className="flex flex-col gap-4">
      <Field id={fileId} label="Till sales file (CSV)" hint="One line per item sold or per item and day, with a header row. Nothing is saved until you accept it.">
         <input ref={input} id={fileId} aria-describedby={`${fileId}-hint`} type="file" accept=".csv,text/csv,text/plain" className={cx('block w-full rounded-md border border-rule bg-card p-3 text-base', focusRing)} />
      </Field>
      {progress !== null && (
        <div>
          <div role="progressbar" aria-label="Upload progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="h-3 w-full overflow-hidden rounded-full bg-rule">
            <div className="h-full bg-slate transition-[width]" style={{ width: `${pct}%` }} />
          </div>
          <p className="mt-1 text-sm text-muted tabular-nums">Uploading… {pct}%</p>
        </div>
      )}
      {error && <FormMessage>{error}</FormMessage>}
      <Button type="submit" size="lg" className="self-start" busy={progress !== null}>
        Upload
      </Button>
    </form>
  );
}

/** Which column of the file holds what, with the first lines of the file to judge by. */
function ColumnsStep({ upload, draft, setDraft, onCheck, busy, fieldErrors }: {
  upload: UploadResult;
  draft: Draft;
  setDraft: (d: Draft) => void;
  onCheck: () => void;
  busy: boolean;
  fieldErrors: Record<string, string>;
}) {
  return (
    <section aria-labelledby="columns-title" className="flex flex-col gap-4">
      <h3 id="columns-title" className="text-lg font-bold">
        Columns of {upload.import.filename}
      </h3>
      {upload.columnsRemembered && <FormMessage tone="info">These are the columns you chose for this site's last file; check them and carry on.</FormMessage>}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {COLUMN_FIELDS.map((f) => (
          <Field key={f.key} label={f.required ? `${f.label} column` : `${f.label} column (optional)`} error={fieldErrors[`columns.${f.key}`]}>
            <Select value={draft[f.key]} onChange={(e) => setDraft({ ...draft, [f.key]: e.target.value })} className="py-3">
              <option value="">{f.required ? 'Choose a column' : 'Not in this file'}</option>
              {upload.headers.map((h) => (
                <option key={h} value={h}>
                  {h}
                </option>
              ))}
            </Select>
          </Field>
        ))}
        <Field label="Dates are written as">
          <Select value={draft.dateFormat} onChange={(e) => setDraft({ ...draft, dateFormat: e.target.value as DateFormat })} className="py-3">
            {DATE_FORMATS.map((d) => (
              <option key={d.value} value={d.value}>
                {d.label}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      {upload.sample.length > 0 && <SampleTable headers={upload.headers} sample={upload.sample} />}
      <Button size="lg" className="self-start" onClick={onCheck} busy={busy} disabled={COLUMN_FIELDS.some((f) => f.required && !draft[f.key])}>
        Check the file
      </Button>
    </section>
  );
}

/** The first lines of the file as read, sortable by any column (values are the file's own text). */
function SampleTable({ headers, sample }: { headers: string[]; sample: string[][] }) {
  const value = useCallback((row: string[], key: string) => row[Number(key)], []);
  const { sorted, sort, onSort } = useSortedRows<string[], string>(sample, null, value);
  return (
    <Table caption="The first lines of the file">
      <THead>
        <tr>
          {headers.map((h, j) => (
            <SortHeader key={h} label={h} sortKey={String(j)} sort={sort} onSort={onSort} />
          ))}
        </tr>
      </THead>
      <tbody>
        {sorted.map((row) => (
          <tr key={sample.indexOf(row)}>
            {row.map((cell, j) => (
              <Td key={j}>{cell}</Td>
            ))}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

type ErrorKey = 'line' | 'message';
const errorText = (e: ImportError) => e.message.replace(/^Line \d+:\s*/, '');

/** The lines that could not be read, by line number; searchable when there are more than a few. */
function ImportErrors({ errors }: { errors: ImportError[] }) {
  const [search, setSearch] = useState('');
  const shown = useMemo(() => errors.filter((e) => matchesSearch(search, errorText(e))), [errors, search]);
  const value = useCallback((e: ImportError, key: ErrorKey) => (key === 'line' ? e.line : errorText(e)), []);
  const { sorted, sort, onSort } = useSortedRows<ImportError, ErrorKey>(shown, { key: 'line', direction: 'asc' }, value);
  return (
    <div className="mt-3 flex flex-col gap-3">
      {errors.length > 5 && (
        <TableFilters shown={shown.length} total={errors.length}>
          <TableSearch label="Search the errors" value={search} onChange={setSearch} placeholder="e.g. quantity" />
        </TableFilters>
      )}
      <Table caption="Lines that could not be read" data-testid="import-errors">
        <THead>
          <tr>
            <SortHeader label="Line" sortKey="line" sort={sort} onSort={onSort} figure className="w-24" />
            <SortHeader label="What is wrong" sortKey="message" sort={sort} onSort={onSort} />
          </tr>
        </THead>
        <tbody>
          {sorted.map((e) => (
            <tr key={`${e.line}-${e.message}`}>
              <Td figure className="font-bold" data-col="line">{e.line}</Td>
              <Td>{errorText(e)}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}

/** The check's result: errors by line, totals, and the till's names matched to our drinks and sizes. */
function ItemsStep({ preview, choice, setChoice }: { preview: ImportPreview; choice: Record<string, string>; setChoice: (k: string, v: string) => void }) {
  return (
    <section aria-labelledby="items-title" className="flex flex-col gap-4">
      <h3 id="items-title" className="text-lg font-bold">
        Match the till's items to your drinks
      </h3>
      <p className="text-base">
        <span className="tabular-nums">{preview.rowCount}</span> lines
        {preview.firstDay && preview.lastDay && (
          <>
            {' '}
            from {formatDate(preview.firstDay)} to {formatDate(preview.lastDay)}
          </>
        )}
        , net sales <span className="font-bold tabular-nums">{formatMoney(preview.netSales, preview.currency)}</span>.
      </p>
      <ul className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-card">
        {preview.items.map((item) => {
          const k = itemKey(item);
          const label = item.tillSize ? `${item.tillItem}, ${item.tillSize}` : item.tillItem;
          const top = item.suggestions[0];
          return (
            <li key={k} className="flex flex-col gap-2 px-4 py-3 sm:flex-row sm:items-end sm:justify-between">
              <div>
                <p className="font-medium">{label}</p>
                <p className="text-sm text-muted tabular-nums">
                  {formatQuantity(item.quantity)} sold · {formatMoney(item.netSales, preview.currency)}
                  {item.remembered ? ' · matched before' : !item.drinkSizeId && top ? ` · suggested: ${top.label}` : ''}
                </p>
              </div>
              <Field label={`Our drink for “${label}”`} className="sm:w-72">
                <Select value={choice[k] ?? ''} onChange={(e) => setChoice(k, e.target.value)} invalid={!choice[k]} className="py-3">
                  <option value="">Choose a drink and size</option>
                  {item.suggestions.length > 0 && (
                    <optgroup label="Suggested">
                      {item.suggestions.map((s) => (
                        <option key={s.drinkSizeId} value={s.drinkSizeId}>
                          {s.label}
                        </option>
                      ))}
                    </optgroup>
                  )}
                  <optgroup label="All drinks">
                    {preview.drinkSizes.map((d) => (
                      <option key={d.id} value={d.id}>
                        {d.label}
                      </option>
                    ))}
                  </optgroup>
                </Select>
              </Field>
            </li>
          );
        })}
      </ul>
    </section>
  );
}

/**
 * The whole import: upload, columns, check, matching and accept. Nothing of the file counts until
 * it is accepted; a file with unreadable lines is fixed at the till's end and uploaded again.
 */
export function TillImport({ siteId }: { siteId: string }) {
  const [upload, setUpload] = useState<UploadResult | null>(null);
  const [draft, setDraft] = useState<Draft | null>(null);
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [choice, setChoice] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const check = usePreviewImport();
  const accept = useAcceptImport();
  const discard = useDiscardImport();

  const reset = () => {
    setUpload(null);
    setDraft(null);
    setPreview(null);
    setChoice({});
    check.reset();
    accept.reset();
  };

  const onUploaded = (r: UploadResult) => {
    setDone(null);
    setUpload(r);
    setDraft(draftFrom(r));
    setPreview(null);
  };

  const runCheck = () => {
    if (!upload || !draft) return;
    check.mutate(
      { params: { id: upload.import.id }, body: { columns: mappingOf(draft) } },
      {
        onSuccess: (p) => {
          setPreview(p);
          // Remembered matches first, then the best suggestion; the user can change any of them.
          setChoice(Object.fromEntries(p.items.map((i) => [itemKey(i), i.drinkSizeId ?? i.suggestions[0]?.drinkSizeId ?? ''])));
        },
      },
    );
  };

  const runAccept = () => {
    if (!upload || !draft || !preview) return;
    accept.mutate(
      { params: { id: upload.import.id }, body: { columns: mappingOf(draft), items: preview.items.map((i) => ({ tillItem: i.tillItem, tillSize: i.tillSize, drinkSizeId: choice[itemKey(i)] })) } },
      {
        onSuccess: (r) => {
          reset();
          setDone(`${r.import.filename}: ${r.import.rowCount} lines accepted${r.import.firstDay ? ` for ${formatDate(r.import.firstDay)}${r.import.lastDay && r.import.lastDay !== r.import.firstDay ? ` to ${formatDate(r.import.lastDay)}` : ''}` : ''}.`);
        },
      },
    );
  };

  const startOver = () => {
    if (upload) discard.mutate({ params: { id: upload.import.id } });
    reset();
  };

  const unmapped = preview ? preview.items.filter((i) => !choice[itemKey(i)]).length : 0;
  const checkFields = isApiError(check.error) ? check.error.fields : {};

  return (
    <div className="flex flex-col gap-6">
      {done && (
        <p role="status" className="rounded-md border border-olive/40 bg-card px-4 py-3">
          <StatusMark tone="good">Imported</StatusMark> <span className="ml-1">{done}</span>
        </p>
      )}
      {!upload || !draft ? (
        <UploadStep siteId={siteId} onUploaded={onUploaded} />
      ) : (
        <>
          <div className="flex flex-wrap items-center justify-between gap-3">
            <p className="text-base">
              <StatusMark tone="attention">Not saved yet</StatusMark> <span className="ml-1">{upload.import.filename}</span>
            </p>
            <Button variant="secondary" onClick={startOver}>
              Discard and upload another file
            </Button>
          </div>
          <ColumnsStep upload={upload} draft={draft} setDraft={(d) => { setDraft(d); setPreview(null); }} onCheck={runCheck} busy={check.isPending} fieldErrors={checkFields} />
          {check.error && !Object.keys(checkFields).length && <FormMessage>{isApiError(check.error) ? check.error.message : 'The file could not be checked; try again.'}</FormMessage>}
          {preview && preview.errorCount > 0 && (
            <section aria-labelledby="errors-title" role="alert" className="rounded-lg border border-rose/40 bg-card p-4">
              <h3 id="errors-title" className="text-lg font-bold text-rose">
                {preview.errorCount} {preview.errorCount === 1 ? 'line' : 'lines'} could not be read
              </h3>
              <p className="mt-1 text-base">Correct {preview.errorCount === 1 ? 'it' : 'them'} in the file (or check the columns above), then upload it again. Nothing of this file has been saved.</p>
              <ImportErrors errors={preview.errors} />
              {preview.errors.length < preview.errorCount && <p className="mt-2 text-sm text-muted">The first {preview.errors.length} are listed.</p>}
            </section>
          )}
          {preview && preview.errorCount === 0 && (
            <>
              <ItemsStep preview={preview} choice={choice} setChoice={(k, v) => setChoice((c) => ({ ...c, [k]: v }))} />
              {accept.error && <FormMessage>{isApiError(accept.error) ? (Object.values(accept.error.fields)[0] ?? accept.error.message) : 'Not accepted; try again.'}</FormMessage>}
              <div className="flex flex-wrap items-center gap-4">
                <Button size="lg" onClick={runAccept} busy={accept.isPending} disabled={unmapped > 0}>
                  Accept {preview.rowCount} lines
                </Button>
                {unmapped > 0 && <p className="text-base text-rose">Match {unmapped} more {unmapped === 1 ? 'item' : 'items'} first.</p>}
              </div>
            </>
          )}
        </>
      )}
    </div>
  );
}
