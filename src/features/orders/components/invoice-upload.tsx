import { useId, useRef, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { useUploadInvoice } from '../api/order-actions';
import type { Order } from '../api/types';

/** The supplier's invoice as a PDF, JPEG or PNG (the server checks the file itself, not its name). */
export function InvoiceUpload({ order }: { order: Order }) {
  const upload = useUploadInvoice();
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const { notify } = useToast();
  const id = useId();
  return (
    <form
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (!file) return;
        upload.mutate({ id: order.id, file }, {
          onSuccess: () => {
            notify('Invoice uploaded.');
            setFile(null);
            if (input.current) input.current.value = '';
          },
        });
      }}
    >
      <label htmlFor={id} className="text-sm font-medium text-ink">{order.invoice ? 'Replace the invoice' : "Upload the supplier's invoice"}</label>
      <p id={`${id}-hint`} className="text-sm text-muted">A PDF, JPEG or PNG file.</p>
      <div className="flex flex-wrap items-center gap-3">
        <input ref={input} id={id} type="file" accept="application/pdf,image/jpeg,image/png" aria-describedby={`${id}-hint`}
          className="max-w-full text-sm text-ink file:mr-3 file:rounded-md file:border file:border-rule file:bg-paper file:px-3 file:py-1.5 file:text-ink"
          onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
        <Button type="submit" variant="secondary" size="sm" disabled={!file} busy={upload.isPending}>Upload</Button>
      </div>
      {upload.isError && (
        <p role="alert" className="text-sm font-medium text-rose">
          {isApiError(upload.error) && upload.error.code === 'too_large' ? 'That file is too large. Scan it at a lower resolution or save a smaller PDF.' : isApiError(upload.error) ? upload.error.message : 'The upload failed. Try again.'}
        </p>
      )}
    </form>
  );
}
