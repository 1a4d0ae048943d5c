import { createContext, useContext, useId, type ReactNode } from 'react';
import { cx } from './cx';

interface FieldContextValue {
  id: string;
  describedBy: string | undefined;
  invalid: boolean;
}

const FieldContext = createContext<FieldContextValue | null>(null);

/** Read by Input and Select so they pick up the label's id, hint and error without wiring by hand. */
export function useFieldControl(): FieldContextValue | null {
  return useContext(FieldContext);
}

interface FieldProps {
  label: ReactNode;
  /** Shown under the label, e.g. "At least 10 characters". */
  hint?: ReactNode;
  error?: string;
  /** The unit beside a number field: ml, g, pumps. */
  unit?: ReactNode;
  id?: string;
  className?: string;
  children: ReactNode;
}

/** A label above its control, an optional unit to its right, and the hint and error under it. */
export function Field({ label, hint, error, unit, id, className, children }: FieldProps) {
  const generated = useId();
  const controlId = id ?? `field-${generated}`;
  const hintId = hint ? `${controlId}-hint` : undefined;
  const errorId = error ? `${controlId}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <FieldContext.Provider value={{ id: controlId, describedBy, invalid: Boolean(error) }}>
      <div className={cx('flex flex-col gap-1', className)}>
        <label htmlFor={controlId} className="text-sm font-medium text-ink">
          {label}
        </label>
        {hint && (
          <p id={hintId} className="text-sm text-muted">
            {hint}
          </p>
        )}
        {unit ? (
          <div className="flex items-center gap-2">
            <div className="min-w-0 flex-1">{children}</div>
            <span className="text-sm text-muted">{unit}</span>
          </div>
        ) : (
          children
        )}
        {error && (
          <p id={errorId} className="text-sm font-medium text-rose">
            {error}
          </p>
        )}
      </div>
    </FieldContext.Provider>
  );
}
