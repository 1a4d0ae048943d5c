import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './button';

interface ConfirmDialogProps {
  open: boolean;
  title: string;
  /** What will be lost if the user goes ahead. */
  consequence: ReactNode;
  confirmLabel: string;
  busy?: boolean;
  error?: ReactNode;
  onConfirm: () => void;
  onCancel: () => void;
}

/**
 * Asks before a destructive action and says what will be lost. Built on the
 * native <dialog>: it traps focus, closes on Escape and returns focus itself.
 */
export function ConfirmDialog({ open, title, consequence, confirmLabel, busy, error, onConfirm, onCancel }: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onCancel={(e) => {
        e.preventDefault();
        if (!busy) onCancel();
      }}
      className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded-lg border border-rule bg-card p-6 text-ink shadow-xl backdrop:bg-ink/40"
    >
      <h2 id={titleId} className="text-lg font-bold">
        {title}
      </h2>
      <div id={bodyId} className="mt-2 text-ink">
        {consequence}
      </div>
      {error && (
        <p role="alert" className="mt-3 text-sm font-medium text-rose">
          {error}
        </p>
      )}
      <div className="mt-6 flex justify-end gap-3">
        {/* Cancel comes first and takes focus: the safe choice is the default. */}
        <Button variant="secondary" onClick={onCancel} disabled={busy} autoFocus>
          Cancel
        </Button>
        <Button variant="danger" onClick={onConfirm} busy={busy}>
          {confirmLabel}
        </Button>
      </div>
    </dialog>
  );
}
