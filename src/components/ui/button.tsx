import type { ButtonHTMLAttributes, Ref } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { cx, focusRing } from './cx';

type Variant = 'primary' | 'secondary' | 'danger' | 'quiet';
type Size = 'md' | 'lg' | 'sm';

const variants: Record<Variant, string> = {
  primary: 'bg-copper text-white hover:bg-copper-deep hover:border-copper-deep border border-copper',
  secondary: 'bg-card text-ink border border-rule hover:border-muted',
  danger: 'bg-rose text-white hover:bg-rose/90 border border-rose',
  quiet: 'bg-transparent text-ink underline decoration-copper hover:bg-rule/50 border border-transparent',
};

const sizes: Record<Size, string> = {
  sm: 'px-2.5 py-1 text-sm',
  md: 'px-4 py-2 text-sm',
  lg: 'px-5 py-3 text-lg',
};

export function buttonClasses(variant: Variant = 'primary', size: Size = 'md', className?: string): string {
  return cx(
    'inline-flex items-center justify-center gap-2 rounded-md font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-60 aria-disabled:cursor-not-allowed aria-disabled:opacity-60',
    focusRing,
    variants[variant],
    sizes[size],
    className,
  );
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: Size;
  busy?: boolean;
  ref?: Ref<HTMLButtonElement>;
}

/**
 * A button. While busy it stays focusable (marked aria-disabled, and a press does nothing):
 * a disabled button drops the focus to the page, so a keyboard user who pressed Save would
 * have to find their place again.
 */
export function Button({ variant = 'primary', size = 'md', busy = false, className, disabled, children, type = 'button', onClick, ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, size, className)}
      disabled={disabled}
      aria-disabled={(busy && !disabled) || undefined}
      aria-busy={busy || undefined}
      onClick={(e) => {
        // Also stops a submit button sending its form a second time (a click, or Enter in a field).
        if (busy) return e.preventDefault();
        onClick?.(e);
      }}
      {...rest}
    >
      {busy && <span aria-hidden="true" className="h-3 w-3 animate-spin rounded-full border-2 border-current border-t-transparent" />}
      {children}
    </button>
  );
}

/** A link that looks like a button (for a page's main action when it navigates). */
export function ButtonLink({ variant = 'primary', size = 'md', className, ...rest }: LinkProps & { variant?: Variant; size?: Size }) {
  return <Link className={buttonClasses(variant, size, className)} {...rest} />;
}

/**
 * An inline text link: ink with a copper underline, because copper text on the
 * paper background falls just short of AA contrast (4.4:1) for body-size text;
 * on hover it turns the deeper copper, which keeps 5.2:1 there.
 */
export function TextLink({ className, ...rest }: LinkProps) {
  return <Link className={cx('font-medium text-ink underline decoration-copper decoration-2 underline-offset-2 hover:text-copper-deep', focusRing, 'rounded-sm', className)} {...rest} />;
}
