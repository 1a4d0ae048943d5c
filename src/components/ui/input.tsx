import type { InputHTMLAttributes, Ref, SelectHTMLAttributes, TextareaHTMLAttributes } from 'react';
import { cx, focusRing } from './cx';
import { useFieldControl } from './field';

const control =
  'w-full rounded-md border bg-card px-3 py-2 text-base text-ink placeholder:text-muted disabled:bg-paper disabled:text-muted';

function useControlProps(id: string | undefined, describedBy: string | undefined, invalid: boolean | undefined) {
  const field = useFieldControl();
  const isInvalid = invalid ?? field?.invalid ?? false;
  return {
    id: id ?? field?.id,
    'aria-describedby': describedBy ?? field?.describedBy,
    'aria-invalid': isInvalid || undefined,
    className: cx(control, focusRing, isInvalid ? 'border-rose' : 'border-edge'),
  };
}

interface InputProps extends InputHTMLAttributes<HTMLInputElement> {
  invalid?: boolean;
  ref?: Ref<HTMLInputElement>;
}

export function Input({ id, invalid, className, 'aria-describedby': describedBy, ...rest }: InputProps) {
  const props = useControlProps(id, describedBy, invalid);
  const numeric = rest.inputMode === 'decimal' || rest.inputMode === 'numeric';
  return <input {...rest} {...props} className={cx(props.className, numeric && 'text-right tabular-nums', className)} />;
}

interface SelectProps extends SelectHTMLAttributes<HTMLSelectElement> {
  invalid?: boolean;
  ref?: Ref<HTMLSelectElement>;
}

export function Select({ id, invalid, className, 'aria-describedby': describedBy, children, ...rest }: SelectProps) {
  const props = useControlProps(id, describedBy, invalid);
  return (
    <select {...rest} {...props} className={cx(props.className, 'pr-8', className)}>
      {children}
    </select>
  );
}

interface TextAreaProps extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  invalid?: boolean;
  ref?: Ref<HTMLTextAreaElement>;
}

/** Several lines of text (notes, a method), labelled, described and marked invalid by its Field like Input. */
export function TextArea({ id, invalid, className, 'aria-describedby': describedBy, ...rest }: TextAreaProps) {
  const props = useControlProps(id, describedBy, invalid);
  return <textarea {...rest} {...props} className={cx(props.className, className)} />;
}
